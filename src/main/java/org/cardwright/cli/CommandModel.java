package org.cardwright.cli;

import java.lang.reflect.Field;
import picocli.CommandLine;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Model.OptionSpec;

/**
 * Helpers for the picocli models that {@link Main} builds in code for the commands a short run needs (the root
 * command and {@code fit}): picocli's reading of {@code @Command}/{@code @Option} annotations makes the JDK parse
 * every annotation and generate a proxy class per annotation type at each start (a start-up archive cannot hold
 * them), which cost more than a third of a demo fit's process time before the fit itself
 * (docs/performance.md section 11). The annotations stay on the classes as the declaration the annotation
 * processor checks; {@code CommandModelTest} holds each model built here to the one picocli reads from them
 * (every option's attributes, the usage text, parsing).
 */
final class CommandModel {
    private CommandModel() {
    }

    /** Binds an option to a field of the command object, as picocli does for an annotated field (no lambdas). */
    static final class FieldAccess implements CommandLine.Model.IGetter, CommandLine.Model.ISetter {
        private final Object target;
        private final Field field;

        FieldAccess(Object target, String name) {
            this.target = target;
            try {
                this.field = target.getClass().getDeclaredField(name);
            } catch (NoSuchFieldException e) {
                throw new IllegalStateException(e);
            }
            field.setAccessible(true);
        }

        @Override
        @SuppressWarnings("unchecked")
        public <T> T get() {
            try {
                return (T) field.get(target);
            } catch (IllegalAccessException e) {
                throw new CommandLine.PicocliException("Could not get value for field " + field, e);
            }
        }

        @Override
        @SuppressWarnings("unchecked")
        public <T> T set(T value) {
            try {
                T old = (T) field.get(target);
                field.set(target, value);
                return old;
            } catch (IllegalAccessException e) {
                throw new CommandLine.PicocliException("Could not set value for field " + field + " to " + value, e);
            }
        }
    }

    /** An option bound to the field {@code field} of {@code target}. */
    static OptionSpec.Builder option(Object target, String field, Class<?> type, String... names) {
        FieldAccess access = new FieldAccess(target, field);
        // as picocli reads an annotated field: its name as the default label, its value now as the initial value
        return OptionSpec.builder(names).type(type).getter(access).setter(access).paramLabel("<" + field + ">")
                .descriptionKey("").initialValue(access.get());
    }

    /** A single-valued option with a parameter label and description. */
    static OptionSpec.Builder option(Object target, String field, Class<?> type, String name, String label, String description) {
        return option(target, field, type, name).paramLabel(label).description(description);
    }

    /** A flag (a boolean field, arity 0). */
    static OptionSpec flag(Object target, String field, String name, String description) {
        return option(target, field, boolean.class, name).description(description).build();
    }

    /**
     * picocli's standard help options ({@code mixinStandardHelpOptions}), under the key picocli's own mixin uses, with
     * its names and descriptions; picocli would read them from the annotations of its own mixin class.
     */
    static void addStandardHelp(CommandSpec spec) {
        CommandSpec help = CommandSpec.create();
        help.addOption(OptionSpec.builder("-h", "--help").usageHelp(true).type(boolean.class).paramLabel("<helpRequested>")
                .initialValue(false)
                .descriptionKey("mixinStandardHelpOptions.help").description("Show this help message and exit.").build());
        help.addOption(OptionSpec.builder("-V", "--version").versionHelp(true).type(boolean.class).paramLabel("<versionRequested>")
                .initialValue(false)
                .descriptionKey("mixinStandardHelpOptions.version").description("Print version information and exit.").build());
        spec.addMixin(STANDARD_HELP, help);
    }

    /** The key under which picocli keeps the mixin of {@code mixinStandardHelpOptions = true}. */
    static final String STANDARD_HELP = "mixinStandardHelpOptions";
}
