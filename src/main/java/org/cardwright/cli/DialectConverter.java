package org.cardwright.cli;

import org.cardwright.card.Dialect;
import picocli.CommandLine.ITypeConverter;

/**
 * Reads a {@link Dialect} option by the dialect's short name (any case), so that an enum-typed option takes the
 * names the user knows ({@code ngspice}, {@code spice3}, {@code gnucap}, {@code xyce}); an unknown name is a usage
 * error that lists the valid ones.
 */
final class DialectConverter implements ITypeConverter<Dialect> {
    @Override
    public Dialect convert(String value) {
        return Dialect.byName(value);
    }

    /** The short names, for picocli's {@code ${COMPLETION-CANDIDATES}}. */
    static final class Names extends java.util.ArrayList<String> {
        private static final long serialVersionUID = 1L;

        Names() {
            for (Dialect d : Dialect.values()) {
                add(d.shortName());
            }
        }
    }
}
