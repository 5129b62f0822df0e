package org.loopwright.sim.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import java.util.stream.Stream;

import javax.xml.parsers.DocumentBuilderFactory;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loopwright.sim.metrics.ResponseMetrics;
import org.loopwright.sim.report.HtmlReport;
import org.loopwright.sim.report.HtmlTable;
import org.loopwright.sim.report.NumberText;
import org.loopwright.sim.report.ReportRecord;
import org.w3c.dom.Document;
import org.w3c.dom.Element;
import org.w3c.dom.Node;
import org.w3c.dom.NodeList;

/**
 * The report.html of simulate and compare, read back with the JDK's XML parser: well-formed, the
 * expected table rows, the plots embedded as SVG, nothing loaded from elsewhere, no script.
 */
class HtmlReportTest {

    private static final String XHTML = "http://www.w3.org/1999/xhtml";
    private static final String SVG = "http://www.w3.org/2000/svg";

    private static Path shipped(String name) throws Exception {
        return Path.of(HtmlReportTest.class.getResource("/scenarios/" + name).toURI());
    }

    private static Document parse(Path file) throws Exception {
        DocumentBuilderFactory factory = DocumentBuilderFactory.newInstance();
        factory.setNamespaceAware(true);
        factory.setFeature("http://apache.org/xml/features/nonvalidating/load-external-dtd", false);
        return factory.newDocumentBuilder().parse(file.toFile());
    }

    private static List<Element> elements(Node root, String namespace, String name) {
        NodeList list = root instanceof Document d ? d.getElementsByTagNameNS(namespace, name)
                : ((Element) root).getElementsByTagNameNS(namespace, name);
        List<Element> found = new ArrayList<>();
        for (int i = 0; i < list.getLength(); i++) {
            found.add((Element) list.item(i));
        }
        return found;
    }

    private static List<String> bodyRowFirstCells(Element table) {
        List<String> cells = new ArrayList<>();
        for (Element row : elements(elements(table, XHTML, "tbody").get(0), XHTML, "tr")) {
            cells.add(elements(row, XHTML, "td").get(0).getTextContent());
        }
        return cells;
    }

    private static void assertSelfContained(Document page) {
        assertThat(elements(page, XHTML, "script")).isEmpty();
        assertThat(elements(page, XHTML, "link")).isEmpty();
        Set<String> ids = new HashSet<>();
        List<Element> all = elements(page, "*", "*");
        for (Element element : all) {
            for (String attribute : List.of("src", "href", "xlink:href")) {
                String value = element.getAttribute(attribute);
                assertThat(value.isEmpty() || value.startsWith("data:") || value.startsWith("#"))
                        .as("%s=%s on <%s>", attribute, value, element.getTagName()).isTrue();
            }
            String id = element.getAttribute("id");
            if (!id.isEmpty()) {
                assertThat(ids.add(id)).as("id %s is unique across the inlined plots", id).isTrue();
            }
        }
        String text = page.getDocumentElement().getTextContent();
        assertThat(text).contains(HtmlReport.SAFETY_CAUTION).contains(BuildVersion.line());
        // the empty sign-off block, for people to fill in
        Element signOff = elements(page, XHTML, "table").stream()
                .filter(t -> "signoff".equals(t.getAttribute("class"))).findFirst().orElseThrow();
        assertThat(bodyRowFirstCells(signOff)).containsExactly("prepared by", "checked by");
    }

    /** A table by its caption's start. */
    private static Element table(Document page, String caption) {
        return elements(page, XHTML, "table").stream().filter(t -> !elements(t, XHTML, "caption").isEmpty()
                && elements(t, XHTML, "caption").get(0).getTextContent().startsWith(caption)).findFirst().orElseThrow();
    }

    /** The second cell of the row whose first cell is {@code first}. */
    private static String cell(Element table, String first) {
        for (Element row : elements(elements(table, XHTML, "tbody").get(0), XHTML, "tr")) {
            List<Element> cells = elements(row, XHTML, "td");
            if (cells.get(0).getTextContent().equals(first)) {
                return cells.get(1).getTextContent();
            }
        }
        throw new AssertionError("no row " + first);
    }

    @Test
    void simulateWritesAReportWithTheMetricsThePlotAndTheScenario(@TempDir Path dir) throws Exception {
        // a comment with markup characters: the page must escape them to stay well-formed
        String scenarioText = Files.readString(shipped("booster-pump.yaml")) + "# pressure <4 bar & >1 bar \"ok\"\n";
        Path scenario = dir.resolve("pump.yaml");
        Files.writeString(scenario, scenarioText);
        Path out = dir.resolve("out");
        CommandRun run = CommandRun.of("simulate", scenario.toString(), "--out", out.toString(), "--json");
        assertThat(run.exitCode()).as(run.err()).isZero();
        JsonNode metrics = new ObjectMapper().readTree(run.out());

        Document page = parse(out.resolve("report.html"));
        assertSelfContained(page);
        assertThat(elements(page, XHTML, "title").get(0).getTextContent()).isEqualTo("Simulation of pump.yaml");
        Element metricsTable = table(page, "Response metrics");
        // the verdict first, and the definitions in a paragraph below the table (ResponseMetrics' constants),
        // not in its caption, which is as narrow as the table
        assertThat(elements(metricsTable, XHTML, "caption").get(0).getTextContent()).isEqualTo("Response metrics");
        List<Element> notes = elements((Element) metricsTable.getParentNode(), XHTML, "p");
        assertThat(notes).hasSize(1);
        assertThat(notes.get(0).getAttribute("class")).isEqualTo("note");
        assertThat(notes.get(0).getTextContent()).contains(ResponseMetrics.OVERSHOOT_DEFINITION)
                .contains(ResponseMetrics.SETTLED_RULE);
        assertThat(cell(metricsTable, "response")).isEqualTo("settled").isEqualTo(metrics.get("response").asText());
        assertThat(bodyRowFirstCells(metricsTable)).containsExactly("response", "rise time (10-90 %)", "settling time (2 %)",
                "overshoot", "peak time", "steady-state error", "IAE", "ISE", "ITAE", "total variation of output",
                "time saturated", "limit cycle amplitude", "limit cycle period");
        Element iaeRow = elements(elements(metricsTable, XHTML, "tbody").get(0), XHTML, "tr").get(6);
        assertThat(elements(iaeRow, XHTML, "td").get(1).getTextContent())
                .isEqualTo(NumberText.of(metrics.get("iae").asDouble()));
        assertThat(elements(iaeRow, XHTML, "td").get(2).getTextContent()).isEqualTo("bar·s");
        // the record: the command line, the input file with its SHA-256, the settings in full
        Element record = table(page, "How this report was made");
        assertThat(cell(record, "command line")).isEqualTo("loopwright simulate " + scenario + " --out " + out
                + " --json");
        assertThat(cell(table(page, "Input files"), scenario.toString())).isEqualTo(ReportRecord.sha256(scenario));
        Element settings = table(page, "Controller settings in full");
        assertThat(bodyRowFirstCells(settings)).contains("form", "sample-period", "integral-method", "tracking-time",
                "fault-policy", "output-kind");
        assertThat(cell(settings, "integral-method")).isEqualTo("tustin");
        List<Element> figures = elements(page, XHTML, "figure");
        assertThat(figures).hasSize(1);
        assertThat(elements(figures.get(0), SVG, "svg")).hasSize(1);
        assertThat(elements(figures.get(0), SVG, "path")).isNotEmpty();
        assertThat(elements(page, XHTML, "pre").get(0).getTextContent()).isEqualTo(scenarioText);
    }

    @Test
    void compareWritesAReportWithEveryStudyRowAndEveryPlot(@TempDir Path dir) throws Exception {
        Path scenario = shipped("booster-pump.yaml");
        CommandRun run = CommandRun.of("compare", scenario.toString(), "--periods", "0.2", "--out",
                dir.toString(), "--json");
        assertThat(run.exitCode()).as(run.err()).isZero();
        JsonNode rows = new ObjectMapper().readTree(run.out());

        Document page = parse(dir.resolve("report.html"));
        assertSelfContained(page);
        List<String> labels = bodyRowFirstCells(table(page, "Each discretisation"));
        assertThat(labels).hasSize(rows.size()).startsWith("continuous");
        assertThat(labels).contains("tustin/backward-euler");
        long pngFiles;
        try (Stream<Path> files = Files.list(dir)) {
            pngFiles = files.filter(p -> p.toString().endsWith(".png")).count();
        }
        assertThat(pngFiles).isGreaterThan(3);
        assertThat(elements(page, XHTML, "figure")).hasSize((int) pngFiles);
        assertThat(elements(page, XHTML, "img")).hasSize((int) pngFiles)
                .allSatisfy(img -> assertThat(img.getAttribute("src")).startsWith("data:image/png;base64,"));
        assertThat(elements(page, XHTML, "pre").get(0).getTextContent()).isEqualTo(Files.readString(scenario));
    }

    @Test
    void rowsMustMatchTheHeader() {
        assertThatThrownBy(() -> new HtmlTable("t", List.of("a", "b"), List.of(List.of("1"))))
                .hasMessage("every row must have 2 cells: row=[1]");
    }
}
