package org.loopwright.sim.cli;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.DirectoryStream;
import java.nio.file.FileSystemException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.stream.Stream;

import org.loopwright.sim.config.InputException;
import org.loopwright.sim.config.IoWords;

/**
 * Where a command writes its output files so that a command that fails leaves none of them half
 * written: every file goes first into a hidden staging directory inside the output directory
 * ({@code .loopwright-partial-*}), and only {@link #commit()} moves them, each with one rename, to
 * their places. Closing without a commit deletes the staging directory and whatever is in it.
 *
 * <p>Use: {@code try (OutputStage stage = OutputStage.in(dir, "--out")) { write into stage.directory();
 * stage.commit(); }}. Not thread-safe.
 */
final class OutputStage implements AutoCloseable {

    private final Path target;
    private final Path staging;
    private boolean committed;
    private boolean closed;

    private OutputStage(Path target, Path staging) {
        this.target = target;
        this.staging = staging;
    }

    /**
     * A stage for {@code directory}, created (with its parents) if need be.
     *
     * @param option how the command line named the directory, for the message
     * @throws InputException naming the option when the directory cannot be created or written
     */
    static OutputStage in(Path directory, String option) {
        try {
            Files.createDirectories(directory);
            return new OutputStage(directory, Files.createTempDirectory(directory, ".loopwright-partial-"));
        } catch (IOException | UnsupportedOperationException e) {
            throw InputException.option(option, directory, "must be a directory that can be written ("
                    + IoWords.of(e) + ")");
        }
    }

    /** The directory to write into until the commit. */
    Path directory() {
        return staging;
    }

    /**
     * Moves every staged file to the output directory, replacing files of the same name. A directory
     * standing where a file should go fails the commit before anything is moved, so the output
     * directory keeps its old files rather than a mix of old and new.
     */
    void commit() throws IOException {
        List<Path> files = new ArrayList<>();
        try (DirectoryStream<Path> stream = Files.newDirectoryStream(staging)) {
            stream.forEach(files::add);
        }
        for (Path file : files) {
            Path destination = target.resolve(file.getFileName().toString());
            if (Files.isDirectory(destination)) {
                throw new FileSystemException(destination.toString(), null, "a directory is in the way");
            }
        }
        for (Path file : files) {
            Path destination = target.resolve(file.getFileName().toString());
            try {
                Files.move(file, destination, StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
            } catch (AtomicMoveNotSupportedException e) {
                Files.move(file, destination, StandardCopyOption.REPLACE_EXISTING);
            }
        }
        committed = true;
        close();
    }

    /** Deletes the staging directory and anything left in it. */
    @Override
    public void close() {
        if (closed) {
            return;
        }
        closed = true;
        try (Stream<Path> paths = Files.walk(staging)) {
            for (Path p : paths.sorted(Comparator.reverseOrder()).toList()) {
                Files.deleteIfExists(p);
            }
        } catch (IOException e) {
            if (committed) {
                throw new UncheckedIOException(e);
            }
        }
    }
}
