package org.slackwater.query.ast;

import java.util.Locale;
import java.util.Objects;
import java.util.regex.Pattern;

/**
 * A name such as a variable name: ASCII letters, digits and '_', not starting with a digit,
 * always lower case (the language is case-insensitive).
 *
 * @throws IllegalArgumentException if the name is not of that form
 */
public record Identifier(String name, Position position) implements Node {

    private static final Pattern FORM = Pattern.compile("[a-z_][a-z0-9_]*");

    public Identifier {
        Objects.requireNonNull(name, "name");
        Objects.requireNonNull(position, "position");
        name = name.toLowerCase(Locale.ROOT);
        if (!FORM.matcher(name).matches()) {
            throw new IllegalArgumentException("not an identifier: '" + name + "'");
        }
    }
}
