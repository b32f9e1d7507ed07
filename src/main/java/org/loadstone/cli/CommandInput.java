package org.loadstone.cli;

import java.io.InputStream;
import org.loadstone.units.Precondition;
import picocli.CommandLine;

/**
 * Standard input for the commands that ask the operator questions. Picocli has no notion of an
 * input stream, so the command line is built with {@link #factory}, which hands the stream to
 * every command object that implements {@link Reader}. Tests pass an in-memory stream.
 */
final class CommandInput {
  private CommandInput() {}

  /** A command that reads answers from standard input. */
  interface Reader {
    /** @param in where answers come from; not null */
    void input(InputStream in);
  }

  /** @return a picocli factory that gives {@code in} to every {@link Reader} it creates */
  static CommandLine.IFactory factory(InputStream in) {
    Precondition.notNull(in, "in");
    CommandLine.IFactory base = CommandLine.defaultFactory();
    return new CommandLine.IFactory() {
      @Override
      public <K> K create(Class<K> cls) throws Exception {
        K k = base.create(cls);
        if (k instanceof Reader r) {
          r.input(in);
        }
        return k;
      }
    };
  }
}
