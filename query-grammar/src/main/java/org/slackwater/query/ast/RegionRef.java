package org.slackwater.query.ast;

/** The area a statistic is taken over. */
public sealed interface RegionRef extends Node
        permits NamedRegion, CircleRegion, BoxRegion, WktRegion, ClippedRegion {}
