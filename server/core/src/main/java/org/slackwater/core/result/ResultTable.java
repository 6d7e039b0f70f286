package org.slackwater.core.result;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;

/**
 * The answer to one statement: named, typed columns of equal length, plus metadata (query text,
 * cube versions, units, region area, coverage rule) and warnings for the reader.
 *
 * @param title a one-line description, e.g. "mean chlorophyll over Outer Bay, by week"
 * @param columns the columns, all of one length
 * @param metadata ordered key/value pairs written with the result (JSON metadata, Arrow schema metadata)
 * @param warnings things the reader should know (period clipped to the data, low coverage ...)
 */
public record ResultTable(String title, List<Column> columns, Map<String, String> metadata, List<String> warnings) {
  public ResultTable {
    Objects.requireNonNull(title);
    columns = List.copyOf(columns);
    metadata = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(metadata));
    warnings = List.copyOf(warnings);
    if (columns.isEmpty()) {
      throw new IllegalArgumentException("a result needs at least one column");
    }
    int n = columns.get(0).size();
    for (Column c : columns) {
      if (c.size() != n) {
        throw new IllegalArgumentException("column " + c.name() + " has " + c.size() + " rows, expected " + n);
      }
    }
  }

  /** A copy with one metadata entry added or replaced (kept in its first position if present). */
  public ResultTable with(String key, String value) {
    Map<String, String> m = new LinkedHashMap<>(metadata);
    m.put(key, value);
    return new ResultTable(title, columns, m, warnings);
  }

  public int rowCount() {
    return columns.get(0).size();
  }

  public Column column(String name) {
    return columns.stream().filter(c -> c.name().equals(name)).findFirst()
        .orElseThrow(() -> new IllegalArgumentException("no column " + name));
  }
}
