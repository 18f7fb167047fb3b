package org.cardwright.cli;

import org.cardwright.card.Dialect;
import org.cardwright.workflow.EngineChoice;
import picocli.CommandLine.ITypeConverter;

/**
 * picocli converters for enum-typed options whose values are the names a user knows (any case): an unknown name is a
 * usage error (exit 2) that lists the valid ones. The mapping lives in the enum ({@link Dialect#byName},
 * {@link EngineChoice#byName}), never in a command.
 */
final class OptionConverters {
    private OptionConverters() {
    }

    /** The enum's own message as picocli's whole message ("unknown ... 'x'; valid names: ..."), no class names. */
    private static <T> T named(java.util.function.Supplier<T> lookup) {
        try {
            return lookup.get();
        } catch (IllegalArgumentException e) {
            throw new picocli.CommandLine.TypeConversionException(e.getMessage());
        }
    }

    /** A {@link Dialect} by its short name: ngspice, spice3, gnucap, xyce. */
    static final class DialectName implements ITypeConverter<Dialect> {
        @Override
        public Dialect convert(String value) {
            return named(() -> Dialect.byName(value));
        }
    }

    /** The dialects' short names, for picocli's {@code ${COMPLETION-CANDIDATES}}. */
    static final class DialectNames extends java.util.ArrayList<String> {
        private static final long serialVersionUID = 1L;

        DialectNames() {
            for (Dialect d : Dialect.values()) {
                add(d.shortName());
            }
        }
    }

    /** An {@link EngineChoice} by name: builtin, ngspice, gnucap. */
    static final class Engine implements ITypeConverter<EngineChoice> {
        @Override
        public EngineChoice convert(String value) {
            return named(() -> EngineChoice.byName(value));
        }
    }

    /** A {@link org.cardwright.verify.VerdictBasis} by name: noise, fixed. */
    static final class Verdict implements ITypeConverter<org.cardwright.verify.VerdictBasis> {
        @Override
        public org.cardwright.verify.VerdictBasis convert(String value) {
            return named(() -> org.cardwright.verify.VerdictBasis.byName(value));
        }
    }

    /** A {@link org.cardwright.fit.FitSettings.SelfHeatingRemedy} by name: fit, exclude. */
    static final class SelfHeating implements ITypeConverter<org.cardwright.fit.FitSettings.SelfHeatingRemedy> {
        @Override
        public org.cardwright.fit.FitSettings.SelfHeatingRemedy convert(String value) {
            return named(() -> org.cardwright.fit.FitSettings.SelfHeatingRemedy.byName(value));
        }
    }
}
