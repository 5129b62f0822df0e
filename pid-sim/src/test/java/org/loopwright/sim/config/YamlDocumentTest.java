package org.loopwright.sim.config;

import static java.util.Map.entry;
import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.List;
import java.util.function.Consumer;
import java.util.stream.Stream;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

class YamlDocumentTest {

    private static final String SCENARIO = """
            name: bath warm-up
            duration: 600
            plant: {kind: first-order, gain: 0.5, time-constant: 600}
            setpoints:
              - time: 0
                value: 40
              - time: 120
                value: 60.5
            noise: [0.1, 0.2, 0.05]
            bad-list: [1, two, 3]
            """;

    private static final Keywords<String> KINDS = Keywords.of(entry("first-order", "FO"), entry("second-order", "SO"));

    private final YamlDocument doc = YamlDocument.parse("scenario.yaml", SCENARIO);

    @Test
    void recordsWhereEveryKeyAndItemStarts() {
        assertThat(doc.position("")).isEqualTo(new TextPosition(1, 1));
        assertThat(doc.position("/duration")).isEqualTo(new TextPosition(2, 1));
        assertThat(doc.position("/plant/gain")).isEqualTo(new TextPosition(3, 28));
        assertThat(doc.position("/setpoints/1")).isEqualTo(new TextPosition(7, 5));
        assertThat(doc.position("/setpoints/1/value")).isEqualTo(new TextPosition(8, 5));
        assertThat(doc.position("/noise/2")).isEqualTo(new TextPosition(9, 19));
        // a pointer that names nothing falls back to its nearest parent
        assertThat(doc.position("/plant/delay")).isEqualTo(new TextPosition(3, 1));
    }

    @Test
    void typedReadersReturnTheValues() {
        assertThat(doc.requiredText("/name")).isEqualTo("bath warm-up");
        assertThat(doc.optionalText("/title", "untitled")).isEqualTo("untitled");
        assertThat(doc.requiredNumber("/duration", NumberRule.POSITIVE)).isEqualTo(600.0);
        assertThat(doc.requiredChoice("/plant/kind", KINDS)).isEqualTo("FO");
        assertThat(doc.optionalChoice("/plant/shape", KINDS, "SO")).isEqualTo("SO");
        assertThat(doc.optionalNumber("/plant/delay", NumberRule.NON_NEGATIVE)).isEmpty();
        assertThat(doc.optionalNumber("/plant/time-constant", NumberRule.POSITIVE, 1.0)).isEqualTo(600.0);
        assertThat(doc.numberList("/noise", NumberRule.NON_NEGATIVE)).containsExactly(0.1, 0.2, 0.05);
        assertThat(doc.items("/setpoints")).containsExactly("/setpoints/0", "/setpoints/1");
        assertThat(doc.requiredNumber("/setpoints/1/value", NumberRule.FINITE)).isEqualTo(60.5);
        assertThat(doc.keyName("/setpoints/1/value")).isEqualTo("setpoints[1].value");
        assertThat(doc.sourceText("/setpoints/1/value")).isEqualTo("60.5");
        doc.requireKeys("/plant", List.of("kind", "gain", "time-constant"));
    }

    static Stream<Arguments> badReads() {
        return Stream.of(
                Arguments.of((Consumer<YamlDocument>) d -> d.requiredNumber("/plant/time-constant", NumberRule.FRACTION),
                        "scenario.yaml:3:39: plant.time-constant must be between 0 and 1: plant.time-constant=600"),
                Arguments.of((Consumer<YamlDocument>) d -> d.requiredNumber("/name", NumberRule.POSITIVE),
                        "scenario.yaml:1:1: name must be a number (finite and > 0): name=bath warm-up"),
                Arguments.of((Consumer<YamlDocument>) d -> d.requiredNumber("/plant/delay", NumberRule.NON_NEGATIVE),
                        "scenario.yaml:3:1: missing key 'delay' in plant (a number (finite and >= 0))"),
                Arguments.of((Consumer<YamlDocument>) d -> d.requiredChoice("/setpoints/0/value", KINDS),
                        "scenario.yaml:6:5: setpoints[0].value must be one of first-order, second-order:"
                                + " setpoints[0].value=40"),
                Arguments.of((Consumer<YamlDocument>) d -> d.numberList("/bad-list", NumberRule.FINITE),
                        "scenario.yaml:10:15: bad-list[1] must be a number (finite): bad-list[1]=two"),
                Arguments.of((Consumer<YamlDocument>) d -> d.items("/duration"),
                        "scenario.yaml:2:1: duration must be a list: duration=600"),
                Arguments.of((Consumer<YamlDocument>) d -> d.items("/steps"),
                        "scenario.yaml:1:1: missing key 'steps' (a list)"),
                Arguments.of((Consumer<YamlDocument>) d -> d.requireKeys("/plant", List.of("kind", "gain")),
                        "scenario.yaml:3:39: unknown key 'time-constant' in plant; allowed: kind, gain"),
                Arguments.of((Consumer<YamlDocument>) d -> d.requireKeys("/setpoints/1", List.of("time")),
                        "scenario.yaml:8:5: unknown key 'value' in setpoints[1]; allowed: time"),
                Arguments.of((Consumer<YamlDocument>) d -> d.requireKeys("/noise", List.of("time")),
                        "scenario.yaml:9:1: noise must be a mapping of keys to values: noise=[0.1, 0.2, 0.05]"),
                Arguments.of((Consumer<YamlDocument>) d -> d.requiredText("/plant"),
                        "scenario.yaml:3:1: plant must be a non-empty text:"
                                + " plant={\"kind\":\"first-order\",\"gain\":0.5,\"time-constant\":600}"));
    }

    @ParameterizedTest
    @MethodSource("badReads")
    void badValueIsReportedAtItsKeyWithWhatIsAllowed(Consumer<YamlDocument> read, String message) {
        assertThatThrownBy(() -> read.accept(doc)).isInstanceOf(InputFileException.class).hasMessage(message);
    }

    static Stream<Arguments> badDocuments() {
        return Stream.of(
                Arguments.of("a: 1\n---\nb: 2\n", "x.yaml:3:1: a second YAML document starts here; one document is allowed"),
                Arguments.of("a: [1, 2\n", "x.yaml:1:9: not valid YAML: while parsing a flow sequence"),
                Arguments.of("outer:\n  a: 1\n  a: 2\n", "x.yaml:3:3: duplicate key 'a' (first at line 2); each key may appear once"),
                Arguments.of("gain: &g 2.0\nintegral-time: *g\n",
                        "x.yaml:2:16: YAML anchors and aliases are not supported; write the value itself: *g"),
                Arguments.of("base: &b {gain: 2}\nplant: *b\n",
                        "x.yaml:2:8: YAML anchors and aliases are not supported; write the value itself: *b"),
                Arguments.of("# " + "x".repeat(YamlDocument.MAX_CHARS) + "\n",
                        "x.yaml: has 1048579 characters; the limit for a controller or scenario file is 1048576"));
    }

    @ParameterizedTest
    @MethodSource("badDocuments")
    void badDocumentIsRejectedWithItsLineAndColumn(String yaml, String message) {
        assertThatThrownBy(() -> YamlDocument.parse("x.yaml", yaml)).isInstanceOf(InputFileException.class)
                .hasMessage(message);
    }

    @Test
    void emptyTextIsAnEmptyMapping() {
        YamlDocument empty = YamlDocument.parse("empty.yaml", "");
        assertThat(empty.root().isObject()).isTrue();
        assertThatThrownBy(() -> empty.requiredNumber("/gain", NumberRule.ANY))
                .hasMessage("empty.yaml:1:1: missing key 'gain' (a number)");
    }

    @Test
    void yamlInfinitiesAreNumbersThatOnlyTheAnyRuleAccepts() {
        YamlDocument limits = YamlDocument.parse("limits.yaml", "high: .inf\nlow: -.inf\n");
        assertThat(limits.requiredNumber("/high", NumberRule.ANY)).isEqualTo(Double.POSITIVE_INFINITY);
        assertThat(limits.requiredNumber("/low", NumberRule.ANY)).isEqualTo(Double.NEGATIVE_INFINITY);
        assertThatThrownBy(() -> limits.requiredNumber("/high", NumberRule.FINITE))
                .hasMessage("limits.yaml:1:1: high must be finite: high=.inf");
        assertThatThrownBy(() -> YamlDocument.parse("nan.yaml", "x: .nan\n").requiredNumber("/x", NumberRule.ANY))
                .hasMessage("nan.yaml:1:1: x must be a number: x=.nan");
    }
}
