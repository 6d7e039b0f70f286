package org.slackwater.demo;

/** A water-quality sampling station in the estuary. */
record Station(String name, double lon, double lat) {
}
