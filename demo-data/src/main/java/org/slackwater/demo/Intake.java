package org.slackwater.demo;

/** A drinking-water intake: a point in a named bay segment with a protection radius in metres. */
record Intake(String name, String segment, double lon, double lat, double radiusM) {
}
