package org.slackwater.query.ast;

import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * {@code window <length> before <date>, ... of <driver>, ... over <region> [against <baseline>]
 * [with coverage ...]}: each driver's statistic over the {@code length} before each event
 * (the event day itself excluded), compared with the same calendar window in the baseline
 * years (all years of the data when no baseline is given). Events are whole days. Each driver is
 * taken over its own region ({@code within}) or else over {@code region}.
 *
 * @throws IllegalArgumentException if there is no event or no driver, a driver is listed twice
 *     (the same statistic, variable and region once placed in {@code region}), an event is not
 *     a complete date, or the length is below 1
 */
public record EventWindow(
        Duration length,
        List<PartialDate> events,
        List<SeriesTerm> drivers,
        RegionRef region,
        Optional<Period> baseline,
        Optional<Coverage> coverage,
        Position position)
        implements Statement {

    public EventWindow {
        Objects.requireNonNull(length, "length");
        events = List.copyOf(events);
        drivers = List.copyOf(drivers);
        Objects.requireNonNull(region, "region");
        Objects.requireNonNull(baseline, "baseline");
        Objects.requireNonNull(coverage, "coverage");
        Objects.requireNonNull(position, "position");
        if (length.amount() < 1) {
            throw new IllegalArgumentException("window shorter than 1: " + length.amount());
        }
        if (events.isEmpty() || drivers.isEmpty()) {
            throw new IllegalArgumentException("an event window needs at least one event and one driver");
        }
        SeriesTerms.requireDistinct(drivers, region, "driver");
        for (PartialDate event : events) {
            if (!event.hasDay()) {
                throw new IllegalArgumentException("event date without a day: " + event.text());
            }
        }
    }
}
