package org.loopwright.sim.report;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Base64;
import java.util.List;
import java.util.Objects;
import java.util.regex.Pattern;

/**
 * A self-contained report page, {@value #FILE_NAME}: the title, the safety caution, the record of how it
 * was made ({@link ReportRecord}: tool version, date and time, command line, input files with SHA-256,
 * the controller settings in full), tables, the plots inlined (SVG files as SVG elements, PNG files as data URIs, for plots whose SVG
 * would be too large), and the scenario's text. No scripts and no external files, so the
 * page can be mailed or archived alone. Written as well-formed XHTML (served as HTML5), so any XML
 * parser reads it.
 *
 * <p>The SVG files are XChart's: their XML prolog is dropped and their element ids are prefixed per
 * figure, so the clip paths of one plot do not capture another's. The page ends with an empty sign-off
 * block (prepared by, checked by, date) for people to fill in on paper, and prints on A4 with its tables
 * inside the page.
 *
 * <p>The one report toolkit of the harness: every command's report ({@code simulate}, {@code compare},
 * {@code sweep}, and new ones) calls {@link #write} with a {@link ReportRecord}, tables made by
 * {@link ResultTable#html} and plots styled by {@link PlotStyle}.
 *
 * <p>Example: {@code HtmlReport.write(dir.resolve("report.html"), "Water bath", record,
 * List.of("Step response of the demo."), List.of(table), List.of(dir.resolve("response.svg")), "water-bath.yaml",
 * scenarioText);}
 */
public final class HtmlReport {

    /** The report's file name. */
    public static final String FILE_NAME = "report.html";

    /** The safety caution every report carries (the README's, in short). */
    public static final String SAFETY_CAUTION = "Loopwright is not a safety-rated component and must never be the"
            + " only thing standing between a fault and harm. Keep independent hardware interlocks"
            + " (over-temperature cut-outs, pressure relief, limit switches, emergency stops). Try every setting"
            + " in simulation first, then on the real plant at reduced power or range, with someone watching."
            + " Local codes, standards and licensed practice take precedence over anything here.";

    private static final String STYLE = """
            body{font-family:sans-serif;max-width:64em;margin:1em auto;padding:0 1em;color:#222;line-height:1.4}
            h1{font-size:1.5em}h2{font-size:1.2em;margin-top:1.5em}
            .caution{border:2px solid #b00;background:#fff4f4;padding:.5em 1em}
            table{border-collapse:collapse;margin:.5em 0;font-size:.85em;max-width:100%}
            caption{text-align:left;font-weight:bold;padding:.3em 0}
            p.note{font-size:.85em;margin:.3em 0 1em}
            th,td{border:1px solid #bbb;padding:.2em .4em;text-align:left;vertical-align:top;overflow-wrap:break-word}
            td.number{text-align:right;white-space:nowrap;font-variant-numeric:tabular-nums}
            thead th{background:#eee;font-weight:600}
            td.hash{font-family:monospace;font-size:.9em}
            table.signoff{width:100%}table.signoff td{height:2.2em}
            table.wide{font-size:.72em}table.wide th,table.wide td{padding:.15em .25em}
            figure{margin:1em 0}figure svg,figure img{max-width:100%;height:auto}
            pre{background:#f6f6f6;padding:.5em;white-space:pre-wrap}
            @page{size:A4;margin:15mm}
            @media print{body{max-width:none;margin:0;font-size:9pt}table{font-size:8pt}table.wide{font-size:6.5pt}
            figure,table,.caution{break-inside:avoid}h2{break-after:avoid}}
            """;

    /** Above this many columns a table is set in a smaller type. */
    private static final int WIDE_COLUMNS = 12;

    /** A cell that is a number, or stands for one that does not apply: right-aligned. */
    private static final Pattern NUMBER = Pattern.compile("[-+]?[0-9.]+(e[-+]?[0-9]+)?|-|n/a|NaN|Infinity",
            Pattern.CASE_INSENSITIVE);

    private HtmlReport() {
    }

    /**
     * Writes the page.
     *
     * @param file         where to write it (replaced if it exists)
     * @param title        the page's title
     * @param record       how the report was made: tool version, time, command line, inputs, settings
     * @param paragraphs   short paragraphs of plain text under the title
     * @param tables       the tables, in order
     * @param figures      SVG files to inline, in order
     * @param scenarioName the scenario's name (its file name)
     * @param scenarioText the scenario's text as read
     * @return the file
     */
    public static Path write(Path file, String title, ReportRecord record, List<String> paragraphs, List<HtmlTable> tables,
            List<Path> figures, String scenarioName, String scenarioText) throws IOException {
        List<String> elements = new ArrayList<>();
        for (Path figure : figures) {
            String name = String.valueOf(figure.getFileName());
            if (name.endsWith(".png")) {
                elements.add("<img alt=\"" + escape(name) + "\" src=\"data:image/png;base64,"
                        + Base64.getEncoder().encodeToString(Files.readAllBytes(figure)) + "\"/>");
            } else {
                elements.add(inlineSvg(Files.readString(figure, StandardCharsets.UTF_8), "f" + (elements.size() + 1)
                        + "-"));
            }
        }
        Files.writeString(file, page(title, record, paragraphs, tables, elements, scenarioName, scenarioText),
                StandardCharsets.UTF_8);
        return file;
    }

    /** The page's text, with the figures given as ready XHTML elements. */
    static String page(String title, ReportRecord record, List<String> paragraphs, List<HtmlTable> tables,
            List<String> figureElements, String scenarioName, String scenarioText) {
        StringBuilder html = new StringBuilder(64 * 1024);
        html.append("<!DOCTYPE html>\n<html xmlns=\"http://www.w3.org/1999/xhtml\" lang=\"en\">\n<head>\n")
                .append("<meta charset=\"utf-8\"/>\n<title>").append(escape(title)).append("</title>\n<style>")
                .append(STYLE).append("</style>\n</head>\n<body>\n<h1>").append(escape(title)).append("</h1>\n")
                .append("<p class=\"caution\"><strong>Safety.</strong> ").append(escape(SAFETY_CAUTION))
                .append("</p>\n");
        record(html, record);
        for (String paragraph : paragraphs) {
            html.append("<p>").append(escape(paragraph)).append("</p>\n");
        }
        for (HtmlTable table : tables) {
            table(html, table);
        }
        if (!figureElements.isEmpty()) {
            html.append("<h2>Plots</h2>\n");
        }
        for (String element : figureElements) {
            html.append("<figure>\n").append(element).append("\n</figure>\n");
        }
        html.append("<h2>Scenario <code>").append(escape(Objects.requireNonNull(scenarioName))).append("</code></h2>\n")
                .append("<pre>").append(escape(scenarioText)).append("</pre>\n");
        signOff(html);
        html.append("</body>\n</html>\n");
        return html.toString();
    }

    private static void record(StringBuilder html, ReportRecord record) {
        html.append("<h2>Record</h2>\n");
        table(html, new HtmlTable("How this report was made", List.of("item", "value"), List.of(
                List.of("tool", record.toolVersion()), List.of("made at", record.madeAtText()),
                List.of("command line", record.commandLine()))));
        if (!record.inputs().isEmpty()) {
            html.append("<div>\n<table>\n<caption>Input files (check a copy with sha256sum)</caption>\n")
                    .append("<thead><tr><th scope=\"col\">file</th><th scope=\"col\">SHA-256</th></tr></thead>\n<tbody>\n");
            for (ReportRecord.InputFile input : record.inputs()) {
                html.append("<tr><td>").append(escape(input.name())).append("</td><td class=\"hash\">")
                        .append(input.sha256()).append("</td></tr>\n");
            }
            html.append("</tbody>\n</table>\n</div>\n");
        }
        if (!record.controllerSettings().isEmpty()) {
            List<List<String>> rows = new ArrayList<>();
            record.controllerSettings().forEach((key, value) -> rows.add(List.of(key, settingText(value))));
            table(html, new HtmlTable("Controller settings in full, defaults included (file keys)",
                    List.of("key", "value"), rows));
        }
    }

    /** Significant digits of a setting in the report: enough to retype it, none of a double's noise. */
    static final int SETTING_DIGITS = 6;

    /**
     * A setting's value for people: a number (as the file writes it) to {@value #SETTING_DIGITS}
     * significant digits, an unlimited one ({@code .inf}) as "none", a word as it is.
     */
    static String settingText(String yaml) {
        if (yaml.endsWith(".inf")) {
            return "none";
        }
        try {
            return NumberText.of(Double.parseDouble(yaml), SETTING_DIGITS);
        } catch (NumberFormatException word) {
            return yaml;
        }
    }

    private static void signOff(StringBuilder html) {
        html.append("<h2>Sign-off</h2>\n<table class=\"signoff\">\n<thead><tr><th scope=\"col\">role</th>")
                .append("<th scope=\"col\">name</th><th scope=\"col\">signature</th><th scope=\"col\">date</th>")
                .append("</tr></thead>\n<tbody>\n");
        for (String role : List.of("prepared by", "checked by")) {
            html.append("<tr><td>").append(role).append("</td><td></td><td></td><td></td></tr>\n");
        }
        html.append("</tbody>\n</table>\n");
    }

    private static void table(StringBuilder html, HtmlTable table) {
        // a table of many columns (design's candidates) is set smaller so it fits the page and the print
        html.append(table.header().size() > WIDE_COLUMNS ? "<div>\n<table class=\"wide\">\n<caption>" : "<div>\n<table>\n<caption>").append(escape(table.caption())).append("</caption>\n<thead><tr>");
        for (String name : table.header()) {
            html.append("<th scope=\"col\">").append(escape(name)).append("</th>");
        }
        html.append("</tr></thead>\n<tbody>\n");
        for (List<String> row : table.rows()) {
            html.append("<tr>");
            for (String cell : row) {
                html.append(NUMBER.matcher(cell).matches() ? "<td class=\"number\">" : "<td>").append(escape(cell))
                        .append("</td>");
            }
            html.append("</tr>\n");
        }
        html.append("</tbody>\n</table>\n");
        if (!table.note().isEmpty()) {
            html.append("<p class=\"note\">").append(escape(table.note())).append("</p>\n");
        }
        html.append("</div>\n");
    }

    /**
     * The {@code <svg>} element of an SVG document, without the prolog or doctype before it, its ids
     * and the references to them prefixed.
     */
    static String inlineSvg(String document, String idPrefix) {
        int start = document.indexOf("<svg");
        if (start < 0) {
            throw new IllegalArgumentException("an SVG document must contain an <svg> element: document starts "
                    + document.substring(0, Math.min(40, document.length())));
        }
        return document.substring(start).strip()
                .replace(" id=\"", " id=\"" + idPrefix)
                .replace("url(#", "url(#" + idPrefix)
                .replace("href=\"#", "href=\"#" + idPrefix);
    }

    /** Text with the five XML special characters escaped. */
    public static String escape(String text) {
        StringBuilder out = new StringBuilder(text.length() + 16);
        for (int i = 0; i < text.length(); i++) {
            char c = text.charAt(i);
            switch (c) {
                case '&' -> out.append("&amp;");
                case '<' -> out.append("&lt;");
                case '>' -> out.append("&gt;");
                case '"' -> out.append("&quot;");
                case '\'' -> out.append("&#39;");
                default -> out.append(c);
            }
        }
        return out.toString();
    }
}
