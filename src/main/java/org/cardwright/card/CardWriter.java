package org.cardwright.card;

import freemarker.cache.ClassTemplateLoader;
import freemarker.cache.MultiTemplateLoader;
import freemarker.cache.TemplateLoader;
import freemarker.core.ParseException;
import freemarker.core.TemplateClassResolver;
import freemarker.template.Configuration;
import freemarker.template.ObjectWrapper;
import freemarker.template.SimpleHash;
import freemarker.template.SimpleScalar;
import freemarker.template.SimpleSequence;
import freemarker.template.Template;
import freemarker.template.TemplateException;
import freemarker.template.TemplateExceptionHandler;
import freemarker.template.TemplateModel;
import freemarker.template.TemplateModelException;
import java.io.IOException;
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
 * Writes a {@link ModelCard} in a simulator dialect through that dialect's FreeMarker template: a user's template
 * when the template folder holds one of that name, else the bundled layout, written directly by {@link BuiltinLayout}
 * (the same bytes as the bundled template; FreeMarker is then never configured).
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
 *
 * <p>A template is data from someone else, never code. It reaches no Java class ({@code ?new} refused for every
 * class, {@code ?api} off, a wrapper that knows only text, lists and maps), includes nothing from outside its
 * folder (no backing out, no links that lead out, no special or oversized files), may write at most
 * {@link #MAX_RENDERED_CHARS} characters and run at most {@link #RENDER_TIME_LIMIT_MILLIS} ms, and the card it
 * writes must read back as exactly the fitted card, or it is refused with a {@link CardTemplateException} naming the
 * template file (docs/security.md).
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

    /**
     * Most characters a rendered card may have: 1 MiB. A card of every parameter with a long provenance is a few
     * kilobytes; a template that writes more is broken or hostile, and is stopped before it fills the memory.
     */
    public static final int MAX_RENDERED_CHARS = 1 << 20;
    /** Largest template file read from a user's folder [bytes]: 256 KiB, fifty times the bundled ones. */
    public static final long MAX_TEMPLATE_BYTES = 256 * 1024;
    /** Longest a template may run [ms]: the bundled ones take about a millisecond. */
    public static final long RENDER_TIME_LIMIT_MILLIS = 5_000;

    /** Most characters of FreeMarker's own message in ours (it may quote a bit of the template). */
    private static final int MESSAGE_CHARS = 200;

    /** FreeMarker, set up on the first user template (or on any template when {@link #templatesOnly}); else null. */
    private Configuration configuration;
    private final Optional<Path> templateDirectory;
    /** True when every card goes through FreeMarker, the bundled templates too (to test the plain writer). */
    private final boolean templatesOnly;
    private final java.util.Set<Template> interruptible = java.util.Collections.newSetFromMap(new java.util.IdentityHashMap<>());

    /**
     * @param templateDirectory a folder whose {@code *.ftl} files override the bundled templates of the same name
     * @throws IllegalArgumentException when the folder is given but is not a readable directory
     */
    public CardWriter(Optional<Path> templateDirectory) {
        this(templateDirectory, false);
    }

    private CardWriter(Optional<Path> templateDirectory, boolean templatesOnly) {
        this.templateDirectory = Objects.requireNonNull(templateDirectory, "templateDirectory");
        this.templatesOnly = templatesOnly;
        if (templateDirectory.isPresent()) {
            Path folder = templateDirectory.get();
            if (!Files.isDirectory(folder)) {
                throw new IllegalArgumentException("template folder " + folder + " is not a directory");
            }
            try {
                folder.toRealPath();
            } catch (IOException e) {
                throw new IllegalArgumentException("template folder " + folder + " cannot be read: " + e.getMessage(), e);
            }
        }
    }

    /**
     * A writer that renders the bundled templates through FreeMarker as well, instead of {@link BuiltinLayout}: the
     * reference the plain writer is tested against (same bytes for every dialect).
     */
    static CardWriter templatesOnly(Optional<Path> templateDirectory) {
        return new CardWriter(templateDirectory, true);
    }

    /** FreeMarker's configuration, made on first use (a run with the bundled templates never needs it). */
    private synchronized Configuration configuration() {
        if (configuration == null) {
            configuration = newConfiguration(templateDirectory);
        }
        return configuration;
    }

    private static Configuration newConfiguration(Optional<Path> templateDirectory) {
        Configuration configuration = new Configuration(Configuration.VERSION_2_3_34);
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
        // a template is data from someone else: it sees strings, lists and maps of strings, and can reach no
        // Java class (no ?new, no ?api, no bean wrapper, no templates from outside its folder)
        configuration.setNewBuiltinClassResolver(TemplateClassResolver.ALLOWS_NOTHING_RESOLVER);
        configuration.setAPIBuiltinEnabled(false);
        configuration.setObjectWrapper(new StringsOnlyWrapper());
        configuration.setTemplateUpdateDelayMilliseconds(Long.MAX_VALUE);
        return configuration;
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
            return new MultiTemplateLoader(new TemplateLoader[] {new FolderTemplateLoader(folder), bundled});
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
            entry.put("value", SpiceNumbers.cardValue(p, p.toCardValue(parameters.get(p)), significantDigits));
            lines.add(entry);
        }
        Map<String, Object> model = new LinkedHashMap<>();
        model.put("name", card.name());
        model.put("dialect", dialect.simulator());
        model.put("provenance", card.provenance());
        model.put("parameters", lines);
        String text = userTemplate(dialect.templateFileName()) || templatesOnly
                ? run(dialect.templateFileName(), model)
                : BuiltinLayout.render(dialect, card.name(), card.provenance(), lines);
        checkReadBack(templateLabel(dialect.templateFileName()), text, card.name(), dialect, lines);
        return new Rendered(text, dropped);
    }

    /**
     * The rendered card must read back, through {@link CardReader}, as exactly one {@code .model} statement with
     * the model name and the parameter values given to the template, and nothing else but comments: no other
     * statement, no parameter left out, changed or added. A template that writes anything else is refused.
     */
    private static void checkReadBack(String template, String text, String name, Dialect dialect,
                                      List<Map<String, String>> lines) {
        StringBuilder canonical = new StringBuilder(".model ").append(name).append(" D(\n");
        for (Map<String, String> l : lines) {
            canonical.append("+ ").append(l.get("keyword")).append('=').append(l.get("value")).append('\n');
        }
        canonical.append("+ )\n");
        CardReader reader = new CardReader();
        ParsedCard expected = reader.parse(canonical.toString(), "(expected card)", dialect);
        String refused = template + ": the card it wrote is refused: ";
        CardText.Layout layout;
        try {
            layout = CardText.split(text, "card");
        } catch (CardFormatException e) {
            throw new CardTemplateException(refused + "it does not read back as a card (" + Excerpts.of(e.getMessage(), MESSAGE_CHARS) + ")", e);
        }
        // what is not the .model statement is named first, whatever the reader would say about it
        for (CardText.Statement st : layout.statements()) {
            String keyword = st.tokens().get(0).text();
            if (!keyword.equalsIgnoreCase(".model")) {
                throw new CardTemplateException(refused + "line " + st.firstLine() + " is not part of the .model statement: "
                        + Excerpts.quoted(keyword) + "; a card holds one .model statement and comments only", null);
            }
        }
        ParsedCard got;
        try {
            // the text is split once: the same split would refuse it here as it did not above
            got = reader.parse(layout, "card", dialect, Optional.empty());
        } catch (CardFormatException e) {
            throw new CardTemplateException(refused + "it does not read back as a card (" + Excerpts.of(e.getMessage(), MESSAGE_CHARS) + ")", e);
        }
        if (!got.name().equals(name)) {
            throw new CardTemplateException(refused + "its model name is " + Excerpts.quoted(got.name()) + ", not "
                    + Excerpts.quoted(name), null);
        }
        if (!got.notices().isEmpty()) {
            throw new CardTemplateException(refused + "it adds what was not fitted: " + Excerpts.of(got.notices().get(0)), null);
        }
        for (Param p : Param.values()) {
            boolean want = expected.parameters().isGiven(p);
            boolean has = got.parameters().isGiven(p);
            if (want && !has) {
                throw new CardTemplateException(refused + "it leaves out " + p.keyword() + ", which the fit gave", null);
            }
            if (!want && has) {
                throw new CardTemplateException(refused + "it adds " + p.keyword() + ", which the fit did not give", null);
            }
            if (want && Double.compare(expected.parameters().get(p), got.parameters().get(p)) != 0) {
                throw new CardTemplateException(refused + "it changes " + p.keyword() + " from the fitted value", null);
            }
        }
    }

    /**
     * True when the user's template folder holds a file (or link) of this name, which then replaces the bundled
     * template (exactly when {@link FolderTemplateLoader} finds it; it refuses links out and special files).
     */
    private boolean userTemplate(String templateName) {
        return templateDirectory.isPresent() && Files.exists(templateDirectory.get().resolve(templateName).normalize(),
                java.nio.file.LinkOption.NOFOLLOW_LINKS);
    }

    /** The template file as a user finds it: its path in the template folder, or "bundled NAME". */
    private String templateLabel(String templateName) {
        if (templateDirectory.isPresent() && Files.isRegularFile(templateDirectory.get().resolve(templateName))) {
            return templateDirectory.get().resolve(templateName).toString().replace('\\', '/');
        }
        return templateName;
    }

    private String run(String templateName, Map<String, Object> model) {
        String label = templateLabel(templateName);
        Template template;
        try {
            template = configuration().getTemplate(templateName);
        } catch (ParseException e) {
            throw new CardTemplateException(label + ":" + e.getLineNumber() + ": template syntax error: "
                    + Excerpts.of(firstLine(e.getEditorMessage()), MESSAGE_CHARS), e);
        } catch (IOException e) {
            String where = templateDirectory.map(d -> d + " or ").orElse("") + "the bundled templates";
            for (Throwable c = e; c != null; c = c.getCause()) {
                if (c instanceof TemplateRefused refused) {
                    throw new CardTemplateException(refused.getMessage(), e);
                }
            }
            throw new CardTemplateException("template " + templateName + " not found in " + where, e);
        }
        synchronized (interruptible) {
            if (interruptible.add(template)) {
                // lets the time limit below stop a template that loops without writing
                freemarker.core._CoreAPI.addThreadInterruptedChecks(template);
            }
        }
        BoundedWriter out = new BoundedWriter(MAX_RENDERED_CHARS);
        java.util.concurrent.atomic.AtomicReference<Throwable> failure = new java.util.concurrent.atomic.AtomicReference<>();
        Thread worker = new Thread(() -> {
            try {
                template.process(wrapModel(model), out);
            } catch (Throwable t) {
                failure.set(t);
            }
        }, "cardwright-template");
        worker.setDaemon(true);
        worker.start();
        try {
            worker.join(RENDER_TIME_LIMIT_MILLIS);
        } catch (InterruptedException e) {
            worker.interrupt();
            Thread.currentThread().interrupt();
            throw new CardTemplateException(label + ": interrupted while rendering", e);
        }
        if (worker.isAlive()) {
            worker.interrupt();
            throw new CardTemplateException(label + ": the template ran longer than " + RENDER_TIME_LIMIT_MILLIS / 1000
                    + " s and was stopped; a card template renders in milliseconds", null);
        }
        Throwable t = failure.get();
        if (t != null) {
            throw failed(label, t);
        }
        String text = out.toString().replace("\r\n", "\n").replace('\r', '\n');
        return text.endsWith("\n") ? text : text + "\n";
    }

    private static CardTemplateException failed(String label, Throwable t) {
        if (t instanceof TooLong || t.getCause() instanceof TooLong) {
            return new CardTemplateException(label + ": the template wrote more than " + MAX_RENDERED_CHARS
                    + " characters and was stopped; a card is a few kilobytes", t);
        }
        if (t instanceof OutOfMemoryError) {
            return new CardTemplateException(label + ": the template ran out of memory and was stopped; a card is a few kilobytes", null);
        }
        for (Throwable c = t; c != null; c = c.getCause()) {
            if (c instanceof TemplateRefused refused) {
                Integer line = t instanceof TemplateException e ? e.getLineNumber() : null;
                return new CardTemplateException(label + ":" + (line == null ? 0 : line) + ": " + refused.getMessage(), t);
            }
        }
        if (t instanceof TemplateException e) {
            Integer line = e.getLineNumber();
            return new CardTemplateException(label + ":" + (line == null ? 0 : line) + ": "
                    + Excerpts.of(reason(e), MESSAGE_CHARS), e);
        }
        if (t instanceof IOException e) {
            return new CardTemplateException(label + ": " + Excerpts.of(e.getMessage()), e);
        }
        if (t instanceof Error e) {
            throw e;
        }
        return new CardTemplateException(label + ": the template failed (" + t.getClass().getSimpleName() + ")", t);
    }

    /**
     * FreeMarker's first line, followed, where it only introduces its cause ("Template inclusion failed ...:"), by
     * the first line of the innermost cause.
     */
    private static String reason(TemplateException e) {
        String first = firstLine(e.getMessageWithoutStackTop());
        Throwable inner = e;
        while (inner.getCause() != null && inner.getCause() != inner) {
            inner = inner.getCause();
        }
        if (inner != e && first.endsWith(":")) {
            String why = inner instanceof TemplateException te ? te.getMessageWithoutStackTop() : inner.getMessage();
            return first + " " + firstLine(why);
        }
        return first;
    }

    /** The template's data as FreeMarker's plain models: strings, sequences and hashes, nothing with methods. */
    private static TemplateModel wrapModel(Object value) throws TemplateModelException {
        return new StringsOnlyWrapper().wrap(value);
    }

    /**
     * Wraps strings, lists and maps of them into FreeMarker's simple models, and refuses every other object, so
     * that no Java method or class is reachable from a template.
     */
    static final class StringsOnlyWrapper implements ObjectWrapper {
        @Override
        public TemplateModel wrap(Object obj) throws TemplateModelException {
            if (obj == null) {
                return null;
            }
            if (obj instanceof TemplateModel m) {
                return m;
            }
            if (obj instanceof String s) {
                return new SimpleScalar(s);
            }
            if (obj instanceof List<?> list) {
                SimpleSequence seq = new SimpleSequence(list.size(), this);
                for (Object o : list) {
                    seq.add(wrap(o));
                }
                return seq;
            }
            if (obj instanceof Map<?, ?> map) {
                SimpleHash hash = new SimpleHash(this);
                for (Map.Entry<?, ?> e : map.entrySet()) {
                    hash.put(String.valueOf(e.getKey()), wrap(e.getValue()));
                }
                return hash;
            }
            throw new TemplateModelException("a card template sees only text, lists and maps, not "
                    + obj.getClass().getSimpleName());
        }
    }

    /** The rendered text went over its limit. */
    private static final class TooLong extends IOException {
        private static final long serialVersionUID = 1L;

        TooLong() {
            super("rendered card too long");
        }
    }

    /** A writer that keeps at most {@code limit} characters and fails beyond. */
    private static final class BoundedWriter extends java.io.Writer {
        private final StringBuilder sb = new StringBuilder();
        private final int limit;

        BoundedWriter(int limit) {
            this.limit = limit;
        }

        @Override
        public void write(char[] cbuf, int off, int len) throws IOException {
            if (len > limit - sb.length()) {
                throw new TooLong();
            }
            sb.append(cbuf, off, len);
        }

        @Override
        public void write(String str, int off, int len) throws IOException {
            if (len > limit - sb.length()) {
                throw new TooLong();
            }
            sb.append(str, off, off + len);
        }

        @Override
        public void flush() {
        }

        @Override
        public void close() {
        }

        @Override
        public String toString() {
            return sb.toString();
        }
    }

    /** A user template that is not a regular file of bounded size inside the folder; carried as a cause. */
    private static final class TemplateRefused extends IOException {
        private static final long serialVersionUID = 1L;

        TemplateRefused(String message) {
            super(message);
        }
    }

    /**
     * Templates from one folder only: a name that resolves (after symbolic links) outside the folder, or to anything
     * but a regular file of at most {@link #MAX_TEMPLATE_BYTES}, is refused. FreeMarker normalises names and never
     * lets them back out of the root with {@code ..}; this loader also keeps links and special files out.
     */
    private static final class FolderTemplateLoader implements TemplateLoader {
        private final Path folder;
        private final Path realFolder;

        FolderTemplateLoader(Path folder) throws IOException {
            this.folder = folder;
            this.realFolder = folder.toRealPath();
        }

        @Override
        public Object findTemplateSource(String name) throws IOException {
            Path p = folder.resolve(name).normalize();
            if (!Files.exists(p, java.nio.file.LinkOption.NOFOLLOW_LINKS)) {
                return null;
            }
            String shown = p.toString().replace('\\', '/');
            if (!Files.exists(p)) {
                throw new IOException(new TemplateRefused(shown + ": a symbolic link to nothing, not a template"));
            }
            Path real = p.toRealPath();
            if (!real.startsWith(realFolder)) {
                throw new IOException(new TemplateRefused(shown + ": leads outside the template folder "
                        + folder.toString().replace('\\', '/') + "; refused"));
            }
            if (!Files.isRegularFile(real)) {
                throw new IOException(new TemplateRefused(shown + ": not a regular file; refused"));
            }
            if (Files.size(real) > MAX_TEMPLATE_BYTES) {
                throw new IOException(new TemplateRefused(shown + ": " + Files.size(real) + " bytes, more than a template's limit of "
                        + MAX_TEMPLATE_BYTES + "; refused"));
            }
            return real;
        }

        @Override
        public long getLastModified(Object templateSource) {
            return -1;
        }

        @Override
        public java.io.Reader getReader(Object templateSource, String encoding) throws IOException {
            byte[] bytes;
            try (java.io.InputStream in = Files.newInputStream((Path) templateSource)) {
                bytes = in.readNBytes((int) MAX_TEMPLATE_BYTES + 1);
            }
            if (bytes.length > MAX_TEMPLATE_BYTES) {
                throw new IOException(new TemplateRefused(templateSource + ": grew past a template's limit of "
                        + MAX_TEMPLATE_BYTES + " bytes while read; refused"));
            }
            return new java.io.StringReader(new String(bytes, java.nio.charset.Charset.forName(encoding)));
        }

        @Override
        public void closeTemplateSource(Object templateSource) {
        }
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
