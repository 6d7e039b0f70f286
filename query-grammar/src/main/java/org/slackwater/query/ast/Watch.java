package org.slackwater.query.ast;

import java.util.List;
import java.util.Objects;

/**
 * {@code watch "<name>" over <region> when <condition> [severity <level>] ...}: a standing
 * early-warning rule, checked as new data arrive. Each {@code when} rule raises its severity
 * while its condition holds; a condition's series without a region of its own is taken over
 * the watch's region.
 *
 * @throws IllegalArgumentException if the name is blank or there is no rule
 */
public record Watch(String name, RegionRef region, List<WatchRule> rules, Position position) implements Statement {

    public Watch {
        Objects.requireNonNull(name, "name");
        Objects.requireNonNull(region, "region");
        rules = List.copyOf(rules);
        Objects.requireNonNull(position, "position");
        if (name.isBlank()) {
            throw new IllegalArgumentException("watch name is blank");
        }
        if (rules.isEmpty()) {
            throw new IllegalArgumentException("a watch needs at least one rule");
        }
    }
}
