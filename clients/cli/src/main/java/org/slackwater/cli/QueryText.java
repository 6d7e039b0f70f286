package org.slackwater.cli;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;

/**
 * Where the query text comes from: the TEXT argument, a {@code .swq} file ({@code -f}), or
 * standard input (no TEXT, or TEXT {@code -}). Files and standard input are read as UTF-8.
 *
 * <p>Failure modes ({@link CliFailure}, {@link Cli#LOCAL}): both TEXT and {@code -f}; a file that
 * is missing, unreadable or not UTF-8; an empty query.
 */
final class QueryText {
  private QueryText() {}

  static String resolve(String text, Path file, InputStream stdin) throws CliFailure {
    boolean fromArgument = text != null && !text.equals("-");
    if (fromArgument && file != null) {
      throw new CliFailure(Cli.LOCAL, "give the query either as TEXT or with -f FILE, not both");
    }
    String q;
    if (file != null) {
      q = readFile(file);
    } else if (fromArgument) {
      q = text;
    } else {
      try {
        q = new String(stdin.readAllBytes(), StandardCharsets.UTF_8);
      } catch (IOException e) {
        throw new CliFailure(Cli.LOCAL, "cannot read the query from standard input (" + Cli.describe(e) + ")", e);
      }
    }
    if (q.isBlank()) {
      throw new CliFailure(Cli.LOCAL, "the query is empty; give it as TEXT, with -f FILE.swq, or on standard input");
    }
    return q;
  }

  private static String readFile(Path file) throws CliFailure {
    try {
      return Files.readString(file, StandardCharsets.UTF_8);
    } catch (NoSuchFileException e) {
      throw new CliFailure(Cli.LOCAL, "cannot read the query file '" + file + "': there is no such file", e);
    } catch (CharacterCodingException e) {
      throw new CliFailure(Cli.LOCAL, "cannot read the query file '" + file + "': it is not UTF-8 text", e);
    } catch (IOException e) {
      throw new CliFailure(Cli.LOCAL, "cannot read the query file '" + file + "' (" + Cli.describe(e) + ")", e);
    }
  }
}
