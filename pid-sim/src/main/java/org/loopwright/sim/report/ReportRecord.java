package org.loopwright.sim.report;

import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.DigestInputStream;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.time.ZoneOffset;
import java.time.ZonedDateTime;
import java.time.format.DateTimeFormatter;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.Collections;
import java.util.HexFormat;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * What a report must say about how it was made, so that it can be filed as a commissioning record:
 * the tool and its version, the date and time, the command line, every input file with its SHA-256
 * (so that the file a reader holds can be checked against the one that was used), and the controller
 * settings in full, every key with its value, defaults included.
 *
 * <p>Example: {@code ReportRecord.of("loopwright 0.1.0", List.of("simulate", "bath.yaml"),
 * List.of(Path.of("bath.yaml")), ControllerFile.resolved(settings))}.
 *
 * @param toolVersion        the tool's version line, "loopwright 0.1.0"
 * @param madeAt             when the report was made (UTC, whole seconds)
 * @param commandLine        the command as typed, with the tool's name first
 * @param inputs             the input files, each with its SHA-256
 * @param controllerSettings the resolved controller settings, file key to value, in file order
 */
public record ReportRecord(String toolVersion, ZonedDateTime madeAt, String commandLine, List<InputFile> inputs,
        Map<String, String> controllerSettings) {

    /**
     * One input file.
     *
     * @param name   the file as the user named it
     * @param sha256 its SHA-256, 64 lower-case hex digits
     */
    public record InputFile(String name, String sha256) {
    }

    /** Copies the lists and the map (in order). */
    public ReportRecord {
        inputs = List.copyOf(inputs);
        controllerSettings = Collections.unmodifiableMap(new LinkedHashMap<>(controllerSettings));
    }

    /**
     * The record of a report made now.
     *
     * @param toolVersion        the tool's version line
     * @param arguments          the command-line arguments after the tool's name
     * @param inputs             the input files read (each is hashed now)
     * @param controllerSettings the resolved controller settings
     * @return the record
     * @throws IOException when an input file cannot be read
     */
    public static ReportRecord of(String toolVersion, List<String> arguments, List<Path> inputs,
            Map<String, String> controllerSettings) throws IOException {
        List<InputFile> files = new ArrayList<>();
        for (Path input : inputs) {
            files.add(new InputFile(input.toString(), sha256(input)));
        }
        List<String> words = new ArrayList<>();
        words.add("loopwright");
        arguments.stream().map(ReportRecord::quoted).forEach(words::add);
        return new ReportRecord(toolVersion, ZonedDateTime.now(ZoneOffset.UTC).truncatedTo(ChronoUnit.SECONDS),
                String.join(" ", words), files, controllerSettings);
    }

    /** @return the date and time as the report prints it: "2026-12-02 03:15:07 UTC" */
    public String madeAtText() {
        return madeAt.format(DateTimeFormatter.ofPattern("yyyy-MM-dd HH:mm:ss 'UTC'"));
    }

    /**
     * The SHA-256 of a file's bytes.
     *
     * @param file the file
     * @return 64 lower-case hex digits
     * @throws IOException when the file cannot be read
     */
    public static String sha256(Path file) throws IOException {
        MessageDigest digest;
        try {
            digest = MessageDigest.getInstance("SHA-256");
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("every Java platform has SHA-256", e);
        }
        try (InputStream in = new DigestInputStream(Files.newInputStream(file), digest)) {
            in.transferTo(OutputStream.nullOutputStream());
        }
        return HexFormat.of().formatHex(digest.digest());
    }

    /** An argument as a shell would need it: quoted when it holds a space or a quote. */
    private static String quoted(String argument) {
        return argument.matches("[A-Za-z0-9_./:=,%+@-]+") ? argument : "'" + argument.replace("'", "'\\''") + "'";
    }
}
