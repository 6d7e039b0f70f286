package org.slackwater.cli;

import java.io.IOException;
import java.io.InputStream;
import java.nio.ByteBuffer;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;

/**
 * A UTF-8 text file named on the command line, or standard input for {@code -}. Strict: bytes
 * that are not UTF-8 are refused rather than silently replaced, because a watch text, an events
 * file or a channels file with a mangled character would be stored or sent mangled.
 *
 * <p>Failure mode: {@link CliFailure} with {@link Cli#LOCAL}, naming what the file is for (e.g.
 * "the events file"), the file, and what is wrong with it.
 */
final class TextInput {
  static final String STANDARD_INPUT = "-";

  private TextInput() {}

  /** The text of {@code name} ({@code -}: standard input); {@code what} names it in messages, e.g. "events file". */
  static String read(String name, InputStream stdin, String what) throws CliFailure {
    boolean fromStdin = name.equals(STANDARD_INPUT);
    String shown = fromStdin ? "the " + what + " on standard input" : "the " + what + " '" + name + "'";
    try {
      byte[] bytes = fromStdin ? stdin.readAllBytes() : Files.readAllBytes(Path.of(name));
      return StandardCharsets.UTF_8.newDecoder().onMalformedInput(CodingErrorAction.REPORT)
          .onUnmappableCharacter(CodingErrorAction.REPORT).decode(ByteBuffer.wrap(bytes)).toString();
    } catch (NoSuchFileException e) {
      throw new CliFailure(Cli.LOCAL, "cannot read " + shown + ": there is no such file", e);
    } catch (CharacterCodingException e) {
      throw new CliFailure(Cli.LOCAL, "cannot read " + shown + ": it is not UTF-8 text; save it as UTF-8", e);
    } catch (IOException | java.nio.file.InvalidPathException e) {
      throw new CliFailure(Cli.LOCAL, "cannot read " + shown + " (" + Cli.describe(e) + ")", e);
    }
  }

  /** How messages name the input: {@code events file 'x.csv'} or {@code events file on standard input}. */
  static String label(String name, String what) {
    return name.equals(STANDARD_INPUT) ? what + " on standard input" : what + " '" + name + "'";
  }
}
