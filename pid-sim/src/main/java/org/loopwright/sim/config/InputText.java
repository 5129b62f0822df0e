package org.loopwright.sim.config;

import java.io.IOException;
import java.io.Reader;
import java.io.StringReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;

/**
 * Reading the text of an input file, and splitting a CSV text into rows, with every failure as an
 * {@link InputFileException} that names the file. One CSV dialect for every table the harness reads:
 * RFC 4180, {@code #} comment lines, spaces around cells and empty lines ignored.
 *
 * <p>Thread-safe: stateless.
 */
public final class InputText {

    private static final CSVFormat CSV = CSVFormat.RFC4180.builder()
            .setCommentMarker('#')
            .setIgnoreSurroundingSpaces(true)
            .setIgnoreEmptyLines(true)
            .get();

    private InputText() {
    }

    /**
     * The whole file as UTF-8 text.
     *
     * @throws InputFileException naming the file when it cannot be read
     */
    public static String read(Path file) {
        try {
            return Files.readString(file, StandardCharsets.UTF_8);
        } catch (IOException | RuntimeException e) {
            throw InputFileException.whole(file.toString(), "cannot be read (" + IoWords.of(e) + ")", e);
        }
    }

    /**
     * A reader of the file's UTF-8 text, for reading a large file a row at a time.
     *
     * @throws InputFileException naming the file when it cannot be opened
     */
    public static Reader open(Path file) {
        try {
            return Files.newBufferedReader(file, StandardCharsets.UTF_8);
        } catch (IOException | RuntimeException e) {
            throw InputFileException.whole(file.toString(), "cannot be read (" + IoWords.of(e) + ")", e);
        }
    }

    /**
     * A parser of CSV text in the harness's one dialect, reading rows as they are asked for.
     *
     * @param fileName how messages name the source
     * @throws InputFileException when the text cannot be read
     */
    public static CSVParser csvParser(String fileName, Reader reader) {
        try {
            return CSVParser.builder().setReader(reader).setFormat(CSV).get();
        } catch (IOException | RuntimeException e) {
            throw InputFileException.whole(fileName, "cannot be read (" + IoWords.of(e) + ")", e);
        }
    }

    /**
     * The rows of a CSV text, the header first.
     *
     * @param fileName        how messages name the source
     * @param requiredColumns named in the message when there is no header row
     * @throws InputFileException when the text is not valid CSV or has no header row
     */
    public static List<List<String>> csvRows(String fileName, String text, List<String> requiredColumns) {
        List<List<String>> rows = new ArrayList<>();
        try (Reader reader = new StringReader(text);
             CSVParser parser = CSVParser.builder().setReader(reader).setFormat(CSV).get()) {
            for (CSVRecord record : parser) {
                rows.add(record.toList());
            }
        } catch (IOException | RuntimeException e) {
            throw InputFileException.whole(fileName, "not valid CSV (" + e.getMessage() + ")", e);
        }
        if (rows.isEmpty()) {
            throw InputFileException.whole(fileName, "has no header row; required columns: "
                    + String.join(", ", requiredColumns));
        }
        return rows;
    }
}
