package org.cardwright.library;

import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.stream.Collectors;
import org.cardwright.card.Dialect;
import org.cardwright.card.ModelCard;
import org.cardwright.fit.DeviceKind;
import org.cardwright.fit.ParameterRule;

/**
 * One part of a model library, as its device file describes it.
 *
 * @param path       the device file
 * @param model      model name on the cards
 * @param kind       device kind (presets for what the data cannot determine)
 * @param data       data files with their conditions, in the order written
 * @param rules      parameter rules, in the order written (same syntax as {@code fit --set})
 * @param dialects   dialects to write, in order, without repeats
 * @param digits     significant digits on the cards
 * @param cards      folder for the cards and the build record, relative to the device file's folder
 * @param templates  folder of card templates overriding the bundled ones, relative to the device file's folder
 * @param tolerances limits for check and compare
 * @param tweak      a parameter pinned or nudged after the fit, if any
 */
public record DeviceFile(Path path, String model, DeviceKind kind, List<DataSource> data, List<ParameterRule> rules,
                         List<Dialect> dialects, int digits, String cards, Optional<String> templates,
                         PartTolerances tolerances, Optional<Tweak> tweak) {
    /** Default significant digits on a card (as {@code fit}). */
    public static final int DEFAULT_DIGITS = 7;

    public DeviceFile {
        Objects.requireNonNull(path, "path");
        Objects.requireNonNull(kind, "kind");
        Objects.requireNonNull(cards, "cards");
        Objects.requireNonNull(templates, "templates");
        Objects.requireNonNull(tolerances, "tolerances");
        Objects.requireNonNull(tweak, "tweak");
        if (!ModelCard.isSpiceIdentifier(model)) {
            throw new IllegalArgumentException("model name '" + model + "' is not a SPICE identifier");
        }
        data = List.copyOf(data);
        rules = List.copyOf(rules);
        dialects = List.copyOf(dialects);
        if (data.isEmpty() || dialects.isEmpty()) {
            throw new IllegalArgumentException("a part needs data files and at least one dialect");
        }
        if (dialects.stream().distinct().count() != dialects.size()) {
            throw new IllegalArgumentException("a dialect is listed twice");
        }
    }

    /** The folder the device file stands in. */
    public Path folder() {
        Path parent = path.toAbsolutePath().normalize().getParent();
        return parent == null ? Path.of("/") : parent;
    }

    /** The folder the cards and the build record go to. */
    public Path cardFolder() {
        return folder().resolve(cards).normalize();
    }

    /** The card for {@code d}: {@code CARDS/MODEL.DIALECT.lib}, as {@code fit} names it. */
    public Path cardPath(Dialect d) {
        return cardFolder().resolve(model + "." + d.shortName() + ".lib");
    }

    /** The build record beside the cards: {@code CARDS/MODEL.state}. */
    public Path statePath() {
        return cardFolder().resolve(model + ".state");
    }

    /**
     * The settings as canonical text, one line each, independent of how the file was laid out (comments, order
     * of keys, quoting). A build hashes this, so that only a change of meaning refits.
     */
    public String canonicalSettings() {
        StringBuilder sb = new StringBuilder();
        sb.append("model ").append(model).append('\n');
        sb.append("kind ").append(kind.optionName()).append('\n');
        sb.append("dialects ").append(dialects.stream().map(Dialect::shortName).collect(Collectors.joining(" "))).append('\n');
        sb.append("digits ").append(digits).append('\n');
        sb.append("cards ").append(cards).append('\n');
        sb.append("templates ").append(templates.orElse("(bundled)")).append('\n');
        for (ParameterRule r : rules) {
            sb.append("rule ").append(r.text()).append('\n');
        }
        tweak.ifPresent(t -> sb.append("tweak ").append(t.text()).append('\n'));
        for (DataSource s : data) {
            sb.append("data ").append(s.file()).append(" kind ").append(s.kind().spelling());
            if (s.temperature().isPresent()) {
                sb.append(" temperature ").append(celsiusText(s.temperature().getAsDouble()));
            }
            for (Map.Entry<String, String> o : s.options().entrySet()) {
                sb.append(" option ").append(o.getKey()).append('=').append(o.getValue());
            }
            sb.append('\n');
        }
        return sb.toString();
    }

    /** This part with another tweak (or none). */
    public DeviceFile withTweak(Optional<Tweak> other) {
        return new DeviceFile(path, model, kind, data, rules, dialects, digits, cards, templates, tolerances, other);
    }

    /** Kelvin as degrees C for canonical text: shortest exact decimal of the Celsius value. */
    static String celsiusText(double kelvin) {
        return org.cardwright.model.Celsius.shortest(kelvin);
    }
}
