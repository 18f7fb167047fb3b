package org.cardwright.card;

import freemarker.cache.ClassTemplateLoader;
import freemarker.cache.FileTemplateLoader;
import freemarker.cache.MultiTemplateLoader;
import freemarker.cache.TemplateLoader;
import freemarker.core.ParseException;
import freemarker.template.Configuration;
import freemarker.template.Template;
import freemarker.template.TemplateException;
import freemarker.template.TemplateExceptionHandler;
import java.io.IOException;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.TimeZone;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.Param;

/**
 * Writes a {@link ModelCard} in a simulator dialect through that dialect's FreeMarker template.
 *
 * <p>Every number is formatted here, once, by {@link SpiceNumbers}; a template receives strings only:
 * {@code name}, {@code dialect} (the simulator), {@code provenance} (a list of lines) and {@code parameters}
 * (a list of entries with {@code keyword} and {@code value}), the given parameters the dialect carries, in
 * {@link Param} order, after the dialect's value conversion ({@link Dialect#toCard}: a gnucap card states
 * XTI/N as XTI). The output uses {@code \n} line endings and holds nothing that varies between runs, so the
 * same card gives the same bytes.
 *
 * <p>Templates are looked up in the user's template folder first (when given), then among the templates bundled
 * in the jar, so a user can edit a copy of one without rebuilding.
 */
public final class CardWriter {
    /** Classpath folder of the bundled templates (the project's top-level templates/ folder). */
    static final String BUNDLED_TEMPLATE_PATH = "/org/cardwright/templates";

    /**
     * A rendered card.
     *
     * @param text the card text, {@code \n} line endings
     * @param dropped given parameters the dialect does not carry and that were therefore left out, in
     *     {@link Param} order
     */
    public record Rendered(String text, List<Param> dropped) {
        public Rendered {
            Objects.requireNonNull(text, "text");
            dropped = List.copyOf(dropped);
        }
    }

    private final Configuration configuration;
    private final Optional<Path> templateDirectory;

    /**
     * @param templateDirectory a folder whose {@code *.ftl} files override the bundled templates of the same name
     * @throws IllegalArgumentException when the folder is given but is not a readable directory
     */
    public CardWriter(Optional<Path> templateDirectory) {
        this.templateDirectory = Objects.requireNonNull(templateDirectory, "templateDirectory");
        configuration = new Configuration(Configuration.VERSION_2_3_34);
        configuration.setTemplateLoader(loader(templateDirectory));
        configuration.setDefaultEncoding("UTF-8");
        configuration.setOutputEncoding("UTF-8");
        configuration.setLocale(Locale.ROOT);
        configuration.setTimeZone(TimeZone.getTimeZone("UTC"));
        configuration.setLocalizedLookup(false);
        configuration.setTemplateExceptionHandler(TemplateExceptionHandler.RETHROW_HANDLER);
        configuration.setLogTemplateExceptions(false);
        configuration.setWrapUncheckedExceptions(true);
        configuration.setFallbackOnNullLoopVariable(false);
    }

    private static TemplateLoader loader(Optional<Path> templateDirectory) {
        ClassTemplateLoader bundled = new ClassTemplateLoader(CardWriter.class, BUNDLED_TEMPLATE_PATH);
        if (templateDirectory.isEmpty()) {
            return bundled;
        }
        Path folder = templateDirectory.get();
        if (!Files.isDirectory(folder)) {
            throw new IllegalArgumentException("template folder " + folder + " is not a directory");
        }
        try {
            return new MultiTemplateLoader(new TemplateLoader[] {new FileTemplateLoader(folder.toFile()), bundled});
        } catch (IOException e) {
            throw new IllegalArgumentException("template folder " + folder + " cannot be read: " + e.getMessage(), e);
        }
    }

    /**
     * Renders {@code card} for {@code dialect}.
     *
     * @param significantDigits digits of every number, between {@link SpiceNumbers#MIN_SIGNIFICANT_DIGITS} and
     *     {@link SpiceNumbers#MAX_SIGNIFICANT_DIGITS}
     * @throws CardTemplateException when the template is missing or fails
     */
    public Rendered render(ModelCard card, Dialect dialect, int significantDigits) {
        Objects.requireNonNull(card, "card");
        Objects.requireNonNull(dialect, "dialect");
        if (significantDigits < SpiceNumbers.MIN_SIGNIFICANT_DIGITS
                || significantDigits > SpiceNumbers.MAX_SIGNIFICANT_DIGITS) {
            throw new IllegalArgumentException("significant digits must lie in [" + SpiceNumbers.MIN_SIGNIFICANT_DIGITS
                    + ", " + SpiceNumbers.MAX_SIGNIFICANT_DIGITS + "], got " + significantDigits);
        }
        // the card states values in the dialect's meaning; the rest of the program holds ngspice meaning
        DiodeParameters parameters = dialect.toCard(card.parameters());
        List<Map<String, String>> lines = new ArrayList<>();
        List<Param> dropped = new ArrayList<>();
        for (Param p : Param.values()) {
            if (!parameters.isGiven(p)) {
                continue;
            }
            if (!dialect.carries(p)) {
                dropped.add(p);
                continue;
            }
            Map<String, String> entry = new LinkedHashMap<>();
            entry.put("keyword", dialect.keyword(p));
            entry.put("value", SpiceNumbers.format(p.toCardValue(parameters.get(p)), significantDigits));
            lines.add(entry);
        }
        Map<String, Object> model = new LinkedHashMap<>();
        model.put("name", card.name());
        model.put("dialect", dialect.simulator());
        model.put("provenance", card.provenance());
        model.put("parameters", lines);
        return new Rendered(run(dialect.templateFileName(), model), dropped);
    }

    private String run(String templateName, Map<String, Object> model) {
        Template template;
        try {
            template = configuration.getTemplate(templateName);
        } catch (ParseException e) {
            throw new CardTemplateException(templateName + ":" + e.getLineNumber() + ": template syntax error: "
                    + firstLine(e.getEditorMessage()), e);
        } catch (IOException e) {
            String where = templateDirectory.map(d -> d + " or ").orElse("") + "the bundled templates";
            throw new CardTemplateException("template " + templateName + " not found in " + where, e);
        }
        StringWriter out = new StringWriter();
        try {
            template.process(model, out);
        } catch (TemplateException e) {
            Integer line = e.getLineNumber();
            throw new CardTemplateException(templateName + ":" + (line == null ? 0 : line) + ": "
                    + firstLine(e.getMessageWithoutStackTop()), e);
        } catch (IOException e) {
            throw new CardTemplateException(templateName + ": " + e.getMessage(), e);
        }
        String text = out.toString().replace("\r\n", "\n").replace('\r', '\n');
        return text.endsWith("\n") ? text : text + "\n";
    }

    private static String firstLine(String message) {
        if (message == null) {
            return "unknown problem";
        }
        String trimmed = message.strip();
        int end = trimmed.indexOf('\n');
        return end < 0 ? trimmed : trimmed.substring(0, end).strip();
    }
}
