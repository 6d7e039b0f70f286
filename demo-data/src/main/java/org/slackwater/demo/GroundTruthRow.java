package org.slackwater.demo;

import java.time.LocalDate;
import java.util.List;

/**
 * One planted event as measured on the generated data.
 *
 * @param peakChlorophyll maximum true chlorophyll (mg m-3) in the region on the peak day; NaN for a
 *                        turbidity event
 * @param drivers         planted drivers, e.g. {@code rainfall+}; the sign says which way
 * @param leadDays        for each driver, days from the start of its anomaly to onset
 */
record GroundTruthRow(String eventId, String region, LocalDate onset, LocalDate peak, double peakChlorophyll,
                      List<String> drivers, List<Integer> leadDays) {

  GroundTruthRow {
    drivers = List.copyOf(drivers);
    leadDays = List.copyOf(leadDays);
    if (drivers.size() != leadDays.size()) {
      throw new IllegalArgumentException("event " + eventId + ": " + drivers.size() + " drivers but "
          + leadDays.size() + " lead times");
    }
  }
}
