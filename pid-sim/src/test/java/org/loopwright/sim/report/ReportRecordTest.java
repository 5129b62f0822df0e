package org.loopwright.sim.report;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class ReportRecordTest {

    /** SHA-256("abc"): the worked example of FIPS 180-2, appendix B.1. */
    @Test
    void hashesAFileAsTheStandardsExampleSays(@TempDir Path dir) throws IOException {
        Path file = Files.writeString(dir.resolve("abc.txt"), "abc", StandardCharsets.US_ASCII);
        assertThat(ReportRecord.sha256(file))
                .isEqualTo("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
    }

    @Test
    void recordsTheCommandLineQuotedAndTheInputs(@TempDir Path dir) throws IOException {
        Path file = Files.writeString(dir.resolve("my bath.yaml"), "abc", StandardCharsets.US_ASCII);
        ReportRecord record = ReportRecord.of("loopwright 1.0", List.of("simulate", file.toString()), List.of(file),
                Map.of("form", "ideal"));
        assertThat(record.commandLine()).isEqualTo("loopwright simulate '" + file + "'");
        assertThat(record.inputs()).extracting(ReportRecord.InputFile::sha256)
                .containsExactly("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
        assertThat(record.madeAtText()).matches("\\d{4}-\\d\\d-\\d\\d \\d\\d:\\d\\d:\\d\\d UTC");
    }

    /** The settings table shows what the file says without a double's noise; an unlimited value is "none". */
    @Test
    void settingsReadAsNumbersToSixDigitsAndUnlimitedAsNone() {
        assertThat(HtmlReport.settingText("4.672622782438271")).isEqualTo("4.67262");
        assertThat(HtmlReport.settingText("0.1875427614634711")).isEqualTo("0.187543");
        assertThat(HtmlReport.settingText("0.5")).isEqualTo("0.5");
        assertThat(HtmlReport.settingText("0.0")).isEqualTo("0");
        assertThat(HtmlReport.settingText("-.inf")).isEqualTo("none");
        assertThat(HtmlReport.settingText(".inf")).isEqualTo("none");
        assertThat(HtmlReport.settingText("backward-euler")).isEqualTo("backward-euler");
    }
}
