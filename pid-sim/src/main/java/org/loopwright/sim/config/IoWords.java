package org.loopwright.sim.config;

import java.nio.charset.CharacterCodingException;
import java.nio.file.AccessDeniedException;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.FileSystemException;
import java.nio.file.NoSuchFileException;
import java.nio.file.NotDirectoryException;
import java.util.Locale;

/**
 * A file-system error in the words a user knows ("no such file or directory", "permission denied",
 * "is a directory", "not UTF-8 text"), never the name of a Java exception. Thread-safe: stateless.
 */
public final class IoWords {

    private IoWords() {
    }

    /** What went wrong, in words, without the file's name. */
    public static String of(Throwable e) {
        if (e instanceof NoSuchFileException) {
            return "no such file or directory";
        }
        if (e instanceof AccessDeniedException) {
            return "permission denied";
        }
        if (e instanceof NotDirectoryException) {
            return "not a directory";
        }
        if (e instanceof FileAlreadyExistsException) {
            return "a file of that name is in the way";
        }
        if (e instanceof FileSystemException f && f.getReason() != null) {
            return f.getReason().toLowerCase(Locale.ROOT);
        }
        if (e instanceof CharacterCodingException) {
            return "not UTF-8 text";
        }
        if (e instanceof UnsupportedOperationException) {
            return "not supported by this file system";
        }
        String message = e.getMessage();
        if (message == null || message.isBlank()) {
            return "input/output error";
        }
        // the operating system's words ("Is a directory"), in the middle of our sentence
        return Character.toLowerCase(message.charAt(0)) + message.substring(1);
    }

    /** The file an error names, or null when it names none. */
    public static String file(Throwable e) {
        return e instanceof FileSystemException f ? f.getFile() : null;
    }
}
