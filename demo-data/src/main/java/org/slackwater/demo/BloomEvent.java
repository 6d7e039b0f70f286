package org.slackwater.demo;

import java.time.LocalDate;

/**
 * A planted phytoplankton bloom and the drivers planted before it.
 *
 * @param id           stable identifier, e.g. {@code bloom-2014}
 * @param region       bay segment holding the bloom centre (Mid Reach or Outer Bay)
 * @param wetFactor    Jan-May regional rainfall of the year divided by its climatological expectation
 * @param wetStart     first day of the wet anomaly (1 January)
 * @param spellStart   first day of the warm, clear, calm spell; the spell ends the day before onset
 * @param onset        first day of bloom growth
 * @param plannedPeak  day the bloom shape peaks (the measured peak may differ by the noise)
 * @param amplitude    planted peak concentration at the bloom centre, mg m-3
 * @param lon          planned bloom centre longitude; each grid snaps the centre to its nearest water
 *                     cell in the region
 * @param lat          planned bloom centre latitude
 * @param radiusKm     e-folding radius of the Gaussian bloom patch
 */
record BloomEvent(String id, String region, double wetFactor, LocalDate wetStart, LocalDate spellStart,
                  LocalDate onset, LocalDate plannedPeak, double amplitude, double lon, double lat,
                  double radiusKm) {
}
