package org.loopwright.sim.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import java.util.TreeSet;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

import picocli.CommandLine;
import picocli.CommandLine.Model.OptionSpec;

/**
 * {@code --out DIR} and {@code --json} are declared once ({@link OutputOptions}, {@link JsonOption}) and
 * mean the same in every command: the same words in every {@code --help}, and the same bad {@code --out}
 * is the same bad input (exit 2, one message naming the option and the value) wherever it is given.
 */
class OutputOptionsTest {

    /** The commands that write files into {@code --out DIR}; replay's {@code --out} names one CSV file instead. */
    private static final Set<String> WRITING_FILES = Set.of("simulate", "compare", "sweep", "identify", "design",
            "assess", "timing");

    /** The commands that print JSON and write no files: no --out that would do nothing. */
    private static final Set<String> JSON_ONLY = Set.of("margins", "tune", "autotune");

    @Test
    void everyCommandShowsTheOneDescriptionOfEachOption() {
        Map<String, Set<String>> outDescriptions = new TreeMap<>();
        Map<String, Set<String>> jsonDescriptions = new TreeMap<>();
        Set<String> withOut = new TreeSet<>();
        Set<String> withJson = new TreeSet<>();
        LoopwrightCommand.commandLine().getSubcommands().forEach((name, command) -> {
            OptionSpec out = command.getCommandSpec().findOption("--out");
            if (out != null && !name.equals("replay")) {
                withOut.add(name);
                outDescriptions.computeIfAbsent(String.join(" ", out.description()), d -> new TreeSet<>()).add(name);
            }
            OptionSpec json = command.getCommandSpec().findOption("--json");
            if (json != null) {
                withJson.add(name);
                jsonDescriptions.computeIfAbsent(String.join(" ", json.description()), d -> new TreeSet<>()).add(name);
            }
        });

        assertThat(withOut).isEqualTo(new TreeSet<>(WRITING_FILES));
        Set<String> json = new TreeSet<>(WRITING_FILES);
        json.addAll(JSON_ONLY);
        assertThat(withJson).isEqualTo(json);
        assertThat(outDescriptions).as("one description of --out").hasSize(1);
        assertThat(jsonDescriptions).as("one description of --json").hasSize(1);
    }

    @ParameterizedTest
    @ValueSource(strings = {"simulate", "compare", "sweep", "identify", "design", "assess", "timing"})
    void theSameBadOutIsTheSameBadInputInEveryCommand(String command, @TempDir Path dir) throws IOException {
        Path notADirectory = Files.writeString(dir.resolve("file"), "a file, not a folder").resolve("out");
        List<String> args = new ArrayList<>(arguments(command, dir));
        args.addAll(List.of("--out", notADirectory.toString()));

        CommandRun.assertBadInput(args.toArray(String[]::new), "--out must be a directory that can be written"
                + " (not a directory): --out=" + notADirectory);
    }

    /** The smallest good command line of each command, short to run. */
    private static List<String> arguments(String command, Path dir) throws IOException {
        String scenario = FrequencyCommandsTest.scenario("booster-pump.yaml");
        return switch (command) {
            case "simulate" -> List.of(command, scenario);
            case "compare" -> List.of(command, scenario, "--periods", "0.1");
            case "sweep" -> List.of(command, scenario, "--runs", "2", "--no-progress");
            case "identify" -> List.of(command, FrequencyCommandsTest.scenario("pump-step-test.csv"));
            case "design" -> List.of(command, "--process-gain", "2", "--time-constant", "5", "--dead-time", "1",
                    "--sample-period", "0.25", "--runs", "2", "--no-progress");
            case "assess" -> List.of(command, OutputFailureTest.trace(dir).toString(), "--time-scale", "2");
            case "timing" -> List.of(command, "--rate", "1000", "--seconds", "0.5");
            default -> throw new IllegalArgumentException(command);
        };
    }

    @Test
    void withoutOutAFileWritingCommandNamesItsOwnFolder() {
        CommandLine cli = LoopwrightCommand.commandLine();
        cli.parseArgs("simulate");
        OutputOptions output = (OutputOptions) cli.getSubcommands().get("simulate").getCommandSpec().mixins()
                .get("output").userObject();

        assertThat(output.directory()).isEqualTo(Path.of("loopwright-simulate"));
        assertThat(output.givenDirectory()).isEmpty();
    }
}
