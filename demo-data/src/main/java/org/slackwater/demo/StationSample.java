package org.slackwater.demo;

import java.time.LocalDateTime;

/** One grab-sample value: a row of stations.csv. */
record StationSample(Station station, LocalDateTime time, String variable, double value, String units) {
}
