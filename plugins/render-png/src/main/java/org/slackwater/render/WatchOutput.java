package org.slackwater.render;

import java.time.LocalDate;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import org.slackwater.core.query.WatchStatements;
import org.slackwater.core.result.ResultTable;

/**
 * What every plotted watch output shares, read from its metadata: the watch's name, the evaluated
 * days ({@code evaluated}: "yyyy-mm-dd to yyyy-mm-dd"), the caution, and the footer notes.
 *
 * <p>The caution is never left out of the picture: it is the metadata {@code caution}, else the
 * first value of a {@code caution} column, else the server's standard caution
 * ({@link WatchStatements#CAUTION}), since an early-warning plot without it would be read as more
 * than a screening aid. Warnings that repeat the caution are dropped from the notes, which would
 * otherwise print it twice.
 *
 * <p>Failure modes: a {@code evaluated} entry that is not two ISO 8601 dates, or whose end is
 * before its start, is a {@link PlotException} naming the result and the value.
 */
record WatchOutput(String watch, Optional<LocalDate> from, Optional<LocalDate> to, String caution, List<String> notes) {
  WatchOutput {
    notes = List.copyOf(notes);
  }

  static WatchOutput of(ResultTable t) {
    String watch = Tables.meta(t, "watch", "");
    String caution = caution(t);
    Optional<LocalDate> from = Optional.empty(), to = Optional.empty();
    String evaluated = t.metadata().get("evaluated");
    if (evaluated != null && !evaluated.isBlank()) {
      LocalDate[] range = range(t, evaluated);
      from = Optional.of(range[0]);
      to = Optional.of(range[1]);
    }
    List<String> warnings = new ArrayList<>();
    for (String w : t.warnings()) {
      if (!w.strip().equals(caution.strip()) && !w.strip().equals(WatchStatements.CAUTION)) {
        warnings.add(w);
      }
    }
    ResultTable forNotes = new ResultTable(t.title(), t.columns(), t.metadata(), warnings);
    return new WatchOutput(watch, from, to, caution, Charts.notes(List.of(forNotes)));
  }

  /** "watch \"North Intake bloom risk\"", or "watch" when the result does not name it. */
  String named() {
    return watch.isEmpty() ? "watch" : "watch \"" + watch + "\"";
  }

  private static String caution(ResultTable t) {
    String meta = t.metadata().get("caution");
    if (meta != null && !meta.isBlank()) {
      return meta.strip();
    }
    Optional<String[]> column = Tables.optionalStrings(t, "caution");
    if (column.isPresent()) {
      for (String s : column.get()) {
        if (s != null && !s.isBlank()) {
          return s.strip();
        }
      }
    }
    return WatchStatements.CAUTION;
  }

  private static LocalDate[] range(ResultTable t, String evaluated) {
    String[] parts = evaluated.strip().split("\\s+to\\s+");
    String problem = "the result '" + t.title() + "' gives the evaluated days as '" + evaluated
        + "' (metadata evaluated); a watch plot needs 'yyyy-mm-dd to yyyy-mm-dd', as the server writes it";
    if (parts.length != 2) {
      throw new PlotException(problem);
    }
    try {
      LocalDate a = LocalDate.parse(parts[0]), b = LocalDate.parse(parts[1]);
      if (b.isBefore(a)) {
        throw new PlotException("the result '" + t.title() + "' gives the evaluated days as '" + evaluated
            + "' (metadata evaluated), which end before they start; the first date must not be after the second");
      }
      return new LocalDate[] {a, b};
    } catch (DateTimeParseException e) {
      throw new PlotException(problem);
    }
  }
}
