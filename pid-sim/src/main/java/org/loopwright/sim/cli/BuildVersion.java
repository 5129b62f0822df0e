package org.loopwright.sim.cli;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.util.Properties;

import picocli.CommandLine.IVersionProvider;

/** The CLI's version as the build wrote it into {@code version.properties}: "loopwright 0.1.0-SNAPSHOT". */
public final class BuildVersion implements IVersionProvider {

    private static final String LINE = "loopwright " + read();

    /** @return the version line, "loopwright" and the build's project version */
    public static String line() {
        return LINE;
    }

    @Override
    public String[] getVersion() {
        return new String[] {LINE};
    }

    private static String read() {
        try (InputStream in = BuildVersion.class.getResourceAsStream("version.properties")) {
            if (in == null) {
                throw new IllegalStateException("version.properties is missing from the build");
            }
            Properties properties = new Properties();
            properties.load(in);
            return properties.getProperty("version");
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
