package dev.standin.cli;

import java.io.IOException;
import java.nio.file.AccessDeniedException;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.FileSystemException;
import java.nio.file.NoSuchFileException;
import java.nio.file.NotDirectoryException;
import java.nio.file.Path;

/** Short, readable reasons for I/O failures, for the one-line {@code standin: cannot ...: reason} messages. */
final class IoErrors {

    private IoErrors() {
    }

    /**
     * Why an operation failed: the operating system's reason where Java reports one (e.g.
     * {@code No space left on device}), else a phrase for the exception's kind, naming the file
     * concerned when Java names one.
     */
    static String reason(IOException e, Console console) {
        String file = null;
        if (e instanceof FileSystemException fse && fse.getFile() != null) {
            file = console.show(Path.of(fse.getFile()));
        }
        String reason = e instanceof FileSystemException fse ? fse.getReason() : e.getMessage();
        if (e instanceof AccessDeniedException) {
            reason = "permission denied";
        } else if (e instanceof FileAlreadyExistsException) {
            reason = "exists and is not a directory";
        } else if (e instanceof NoSuchFileException) {
            reason = "no such file or directory";
        } else if (e instanceof NotDirectoryException) {
            reason = "not a directory";
        } else if (reason == null || reason.isBlank()) {
            reason = e.getClass().getSimpleName();
        }
        return file == null ? reason : file + ": " + reason;
    }
}
