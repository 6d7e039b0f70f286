package org.slackwater.core.watch;

import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * Ready-made watch rules built on published guideline values, each with its source and its
 * limits. A preset is a watch text with the region (and the watch's name) filled in by the
 * caller; it is checked and stored like any other watch. Only values with a published source are
 * offered; where a value is recalled rather than read from the source, {@link Preset#source}
 * says so.
 */
public final class WatchPresets {
  /**
   * One preset.
   *
   * @param id short name used in the API
   * @param title what it watches
   * @param source the publication the thresholds come from
   * @param limits what the thresholds do not say (read before relying on them)
   * @param template watch text with {@code {name}} and {@code {region}} to fill in
   */
  public record Preset(String id, String title, String source, String limits, String template) {
    public Preset {
      Objects.requireNonNull(id);
      Objects.requireNonNull(template);
    }

    /** The watch text for a region (a stored region's name). */
    public String text(String region) {
      if (region.contains("\"") || region.isBlank()) {
        throw new IllegalArgumentException("a region name must be non-empty and without double quotes, got '" + region + "'");
      }
      return template.replace("{name}", region + " " + id).replace("{region}", region);
    }
  }

  public static final List<Preset> ALL = List.of(
      new Preset("chlorophyll-recreational",
          "Chlorophyll-a at the recreational-water guidance levels for cyanobacteria",
          "WHO (2003) Guidelines for Safe Recreational Water Environments, Vol. 1, chapter 8: guidance levels of"
              + " 10 ug/L chlorophyll-a (relatively low probability of adverse health effects) and 50 ug/L"
              + " (moderate probability), each with dominance of cyanobacteria (values recalled from memory; check"
              + " the table in the source)",
          "The levels assume cyanobacteria dominate the phytoplankton; satellite chlorophyll-a cannot tell which"
              + " algae are present, and it is a regional mean, not a sample at the intake. They are recreational"
              + " guidance, not drinking-water limits.",
          "watch \"{name}\" over \"{region}\"\n"
              + "  when mean chlorophyll at least 10 ug/L severity notice\n"
              + "  when mean chlorophyll at least 50 ug/L severity warning"),
      new Preset("chlorophyll-recreational-persistent",
          "The same levels held for three days, to ride over single-day retrieval noise",
          "WHO (2003) Guidelines for Safe Recreational Water Environments, Vol. 1, chapter 8 (as above; values"
              + " recalled from memory); the three-day persistence is our choice, not the source's",
          "As above; persistence delays the first notice by two days.",
          "watch \"{name}\" over \"{region}\"\n"
              + "  when mean chlorophyll at least 10 ug/L for 3 days severity notice\n"
              + "  when mean chlorophyll at least 50 ug/L for 3 days severity warning"));

  private WatchPresets() {}

  public static Optional<Preset> find(String id) {
    return ALL.stream().filter(p -> p.id().equalsIgnoreCase(id)).findFirst();
  }
}
