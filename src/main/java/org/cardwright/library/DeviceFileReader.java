package org.cardwright.library;

import com.fasterxml.jackson.annotation.JsonProperty;
import com.fasterxml.jackson.core.JsonLocation;
import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.JsonToken;
import com.fasterxml.jackson.databind.DeserializationContext;
import com.fasterxml.jackson.databind.DeserializationFeature;
import com.fasterxml.jackson.databind.JsonMappingException;
import com.fasterxml.jackson.databind.annotation.JsonDeserialize;
import com.fasterxml.jackson.databind.deser.std.StdDeserializer;
import com.fasterxml.jackson.databind.exc.MismatchedInputException;
import com.fasterxml.jackson.databind.exc.UnrecognizedPropertyException;
import com.fasterxml.jackson.dataformat.yaml.YAMLMapper;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.Set;
import java.util.stream.Collectors;
import org.cardwright.card.Dialect;
import org.cardwright.card.Excerpts;
import org.cardwright.card.SpiceNumbers;
import org.cardwright.fit.DeviceKind;
import org.cardwright.fit.ParameterRule;
import org.cardwright.model.Ngspice39;
import org.cardwright.verify.Tolerance;

/**
 * Reads device files: YAML (through Jackson's YAML module), one part per file. Every key must be one this
 * version knows; an unknown key, a repeated key, a value of the wrong form or an invalid value is a
 * {@link DeviceFileException} naming the file, the line and the key or raw value. The format is documented in
 * docs/device-files.md.
 */
public final class DeviceFileReader {
    /** Device files end with this, e.g. {@code RX10.device.yaml}. */
    public static final String SUFFIX = ".device.yaml";

    private static final YAMLMapper MAPPER = YAMLMapper.builder()
            .enable(DeserializationFeature.FAIL_ON_UNKNOWN_PROPERTIES)
            .enable(DeserializationFeature.FAIL_ON_NULL_FOR_PRIMITIVES)
            .enable(DeserializationFeature.FAIL_ON_TRAILING_TOKENS)
            .enable(JsonParser.Feature.STRICT_DUPLICATE_DETECTION)
            .addHandler(new UnknownKeyHandler())
            .build();

    /** An unknown key, caught while the parser still stands at it (Jackson's own exception comes a token later). */
    static final class UnknownKey extends JsonMappingException {
        private static final long serialVersionUID = 1L;
        final String key;
        final int line;
        final String under;
        final String known;

        UnknownKey(JsonParser p, String key, int line, String under, String known) {
            super(p, "unknown key " + Excerpts.quoted(key));
            this.key = key;
            this.line = line;
            this.under = under;
            this.known = known;
        }
    }

    /** Turns an unknown key into {@link UnknownKey} with the line of its value (on the key's line for a scalar). */
    static final class UnknownKeyHandler extends com.fasterxml.jackson.databind.deser.DeserializationProblemHandler {
        @Override
        public boolean handleUnknownProperty(DeserializationContext ctxt, JsonParser p,
                                             com.fasterxml.jackson.databind.JsonDeserializer<?> deserializer,
                                             Object beanOrClass, String propertyName) throws IOException {
            java.util.Collection<Object> ids = deserializer == null ? List.of() : deserializer.getKnownPropertyNames();
            String known = ids == null ? "" : ids.stream().map(Object::toString).sorted().collect(Collectors.joining(", "));
            StringBuilder where = new StringBuilder();
            com.fasterxml.jackson.core.JsonStreamContext c = p.getParsingContext();
            List<String> parts = new ArrayList<>();
            for (com.fasterxml.jackson.core.JsonStreamContext x = c == null ? null : c.getParent(); x != null && !x.inRoot(); x = x.getParent()) {
                if (x.inObject() && x.getCurrentName() != null) {
                    parts.add(0, x.getCurrentName());
                } else if (x.inArray()) {
                    parts.add(0, "[" + (x.getCurrentIndex() + 1) + "]");
                }
            }
            for (String part : parts) {
                where.append(part.startsWith("[") || where.length() == 0 ? "" : ".").append(part);
            }
            throw new UnknownKey(p, propertyName, line(p.currentTokenLocation()),
                    where.length() == 0 ? "" : " under '" + where + "'", known);
        }
    }

    /**
     * The first line where {@code key} stands as a mapping key, block or flow style; 0 when none does. Used when the
     * parser cannot say where it was (properties buffered for a record's constructor carry no location).
     */
    static int keyLine(String text, String key) {
        java.util.regex.Pattern keyPattern = java.util.regex.Pattern.compile(
                "(^|[{,])[\\s-]*['\"]?" + java.util.regex.Pattern.quote(key) + "['\"]?\\s*:");
        String[] lines = text.split("\r\n|\r|\n", -1);
        for (int i = 0; i < lines.length; i++) {
            String code = lines[i].replaceAll("\\s#.*$", "");
            if (keyPattern.matcher(code).find()) {
                return i + 1;
            }
        }
        return 0;
    }

    /**
     * A YAML syntax error as one line, at the line of the problem: the YAML parser's own marked exception (somewhere
     * in the cause chain Jackson builds) gives the line of its problem mark and its words, without excerpts; empty
     * when the failure is not a YAML syntax error.
     */
    private static java.util.Optional<DeviceFileException> yamlSyntax(Path path, Exception e) {
        for (Throwable t = e; t != null; t = t.getCause()) {
            if (t instanceof org.yaml.snakeyaml.error.MarkedYAMLException m) {
                int line = m.getProblemMark() != null ? m.getProblemMark().getLine() + 1
                        : m.getContextMark() != null ? m.getContextMark().getLine() + 1 : 0;
                List<String> words = new ArrayList<>();
                for (String w : new String[] {m.getContext(), m.getProblem()}) {
                    if (w != null && !w.isBlank()) {
                        words.add(w.strip());
                    }
                }
                return java.util.Optional.of(new DeviceFileException(path, line, "YAML syntax: " + String.join("; ", words), e));
            }
            if (t.getCause() == t) {
                break;
            }
        }
        return java.util.Optional.empty();
    }

    /** A scalar as written and the line it stands on. */
    record Located(String text, int line) {
    }

    /** Reads any scalar (string, number, boolean) as text, remembering its line. */
    static final class LocatedDeserializer extends StdDeserializer<Located> {
        private static final long serialVersionUID = 1L;

        LocatedDeserializer() {
            super(Located.class);
        }

        @Override
        public Located deserialize(JsonParser p, DeserializationContext ctxt) throws IOException {
            JsonToken t = p.currentToken();
            int line = p.currentTokenLocation().getLineNr();
            if (t != null && t.isScalarValue()) {
                return new Located(p.getText(), line);
            }
            return (Located) ctxt.handleUnexpectedToken(Located.class, p);
        }
    }

    record DataEntry(@JsonProperty("file") @JsonDeserialize(using = LocatedDeserializer.class) Located file,
                     @JsonProperty("kind") @JsonDeserialize(using = LocatedDeserializer.class) Located kind,
                     @JsonProperty("temperature") @JsonDeserialize(using = LocatedDeserializer.class) Located temperature,
                     @JsonProperty("options") @JsonDeserialize(contentUsing = LocatedDeserializer.class) Map<String, Located> options) {
    }

    record ToleranceEntry(
            @JsonProperty("forward-rms-mv") @JsonDeserialize(using = LocatedDeserializer.class) Located forwardRms,
            @JsonProperty("forward-max-mv") @JsonDeserialize(using = LocatedDeserializer.class) Located forwardMax,
            @JsonProperty("leakage-factor") @JsonDeserialize(using = LocatedDeserializer.class) Located leakageFactor,
            @JsonProperty("capacitance-percent") @JsonDeserialize(using = LocatedDeserializer.class) Located capacitance,
            @JsonProperty("breakdown-percent") @JsonDeserialize(using = LocatedDeserializer.class) Located breakdown) {
    }

    record TweakEntry(@JsonProperty("set") @JsonDeserialize(using = LocatedDeserializer.class) Located set,
                      @JsonProperty("then") @JsonDeserialize(using = LocatedDeserializer.class) Located then) {
    }

    record Document(@JsonProperty("model") @JsonDeserialize(using = LocatedDeserializer.class) Located model,
                    @JsonProperty("kind") @JsonDeserialize(using = LocatedDeserializer.class) Located kind,
                    @JsonProperty("data") List<DataEntry> data,
                    @JsonProperty("rules") @JsonDeserialize(contentUsing = LocatedDeserializer.class) List<Located> rules,
                    @JsonProperty("dialects") @JsonDeserialize(contentUsing = LocatedDeserializer.class) List<Located> dialects,
                    @JsonProperty("digits") @JsonDeserialize(using = LocatedDeserializer.class) Located digits,
                    @JsonProperty("cards") @JsonDeserialize(using = LocatedDeserializer.class) Located cards,
                    @JsonProperty("templates") @JsonDeserialize(using = LocatedDeserializer.class) Located templates,
                    @JsonProperty("tolerance") ToleranceEntry tolerance,
                    @JsonProperty("tweak") TweakEntry tweak) {
    }

    /**
     * Largest device file read [bytes]: 64 KiB. A device file is a few hundred bytes; a larger one is refused before
     * parsing, so that a file padded with a huge comment cannot hold a build up (the YAML parser takes about 2 s
     * per MiB of a one-line comment: measured 1.4 to 5.5 s for 1 MiB on a loaded 2-core machine).
     */
    public static final int MAX_DEVICE_FILE_BYTES = 64 * 1024;

    private final java.util.Optional<Path> root;
    private final boolean allowOutsideRoot;

    /** A reader that confines nothing: paths in the device file are taken as written (compare --device, tests). */
    public DeviceFileReader() {
        this(java.util.Optional.empty(), true);
    }

    /**
     * A reader for the library under {@code root}: the device file, its data files, its card folder and its template
     * folder must stay inside the root after symbolic links are resolved, unless {@code allowOutsideRoot}.
     */
    public DeviceFileReader(Path root, boolean allowOutsideRoot) {
        this(java.util.Optional.of(root), allowOutsideRoot);
    }

    private DeviceFileReader(java.util.Optional<Path> root, boolean allowOutsideRoot) {
        this.root = root;
        this.allowOutsideRoot = allowOutsideRoot;
    }

    /**
     * Reads and checks one device file. A device file that is a folder, a link to nothing, a FIFO or device, larger
     * than {@link #MAX_DEVICE_FILE_BYTES} or not UTF-8 text is refused before it is parsed.
     */
    public DeviceFile read(Path path) throws DeviceFileException {
        if (!Files.exists(path, java.nio.file.LinkOption.NOFOLLOW_LINKS)) {
            throw new DeviceFileException(path, 0, "no such device file");
        }
        if (!Files.exists(path)) {
            throw new DeviceFileException(path, 0, "a symbolic link to nothing (dangling), not a device file");
        }
        if (root.isPresent() && !allowOutsideRoot) {
            Path real = org.cardwright.workflow.OutputPlan.located(path);
            if (!real.startsWith(org.cardwright.workflow.OutputPlan.located(root.get()))) {
                throw new DeviceFileException(path, 0, "the device file leads outside the library root "
                        + root.get().toString().replace('\\', '/') + " (to " + Excerpts.of(real.toString(), 120)
                        + "); refused (pass --allow-outside-root to allow it)");
            }
        }
        if (Files.isDirectory(path)) {
            throw new DeviceFileException(path, 0, "a folder, not a device file");
        }
        if (!Files.isRegularFile(path)) {
            throw new DeviceFileException(path, 0, "not a regular file (a FIFO, device or socket); refused");
        }
        byte[] bytes;
        try (java.io.InputStream in = Files.newInputStream(path)) {
            bytes = in.readNBytes(MAX_DEVICE_FILE_BYTES + 1);
        } catch (IOException e) {
            throw new DeviceFileException(path, 0, "cannot read the device file (" + Excerpts.of(e.getMessage(), 120) + ")", e);
        }
        if (bytes.length > MAX_DEVICE_FILE_BYTES) {
            throw new DeviceFileException(path, 0, "larger than " + MAX_DEVICE_FILE_BYTES
                    + " bytes, the limit for a device file (one is a few hundred bytes); refused before parsing");
        }
        String text;
        try {
            text = StandardCharsets.UTF_8.newDecoder()
                    .onMalformedInput(java.nio.charset.CodingErrorAction.REPORT)
                    .onUnmappableCharacter(java.nio.charset.CodingErrorAction.REPORT)
                    .decode(java.nio.ByteBuffer.wrap(bytes)).toString();
        } catch (java.nio.charset.CharacterCodingException e) {
            throw new DeviceFileException(path, 0, "not UTF-8 text; a device file is YAML in UTF-8", e);
        }
        return parse(text, path);
    }

    /** Checks one device file's text; {@code path} names it in messages and anchors its relative paths. */
    public DeviceFile parse(String text, Path path) throws DeviceFileException {
        Document doc;
        try {
            doc = MAPPER.readValue(text, Document.class);
        } catch (UnrecognizedPropertyException e) {
            String known = e.getKnownPropertyIds() == null ? "" : e.getKnownPropertyIds().stream()
                    .map(Object::toString).sorted().collect(Collectors.joining(", "));
            int at = e.getProcessor() instanceof JsonParser p ? line(p.currentTokenLocation()) : line(e.getLocation());
            throw new DeviceFileException(path, at, "unknown key " + Excerpts.quoted(e.getPropertyName())
                    + where(e) + (known.isEmpty() ? "" : "; known keys here: " + known), e);
        } catch (MismatchedInputException e) {
            throw new DeviceFileException(path, line(e.getLocation()), "wrong form for "
                    + (e.getPath().isEmpty() ? "the document" : "key '" + pathText(e) + "'") + ": expected "
                    + expected(e.getTargetType()), e);
        } catch (UnknownKey e) {
            int at = e.line > 0 ? e.line : keyLine(text, e.key);
            throw new DeviceFileException(path, at, "unknown key " + Excerpts.quoted(e.key) + e.under
                    + (e.known.isEmpty() ? "" : "; known keys here: " + e.known), e);
        } catch (JsonProcessingException e) {
            java.util.Optional<DeviceFileException> syntax = yamlSyntax(path, e);
            if (syntax.isPresent()) {
                throw syntax.get();
            }
            throw new DeviceFileException(path, line(e.getLocation()), firstLine(e.getOriginalMessage()), e);
        }
        if (doc == null) {
            throw new DeviceFileException(path, 0, "empty device file: it needs at least the keys model and data");
        }
        if (doc.dialects() != null && doc.dialects().isEmpty()) {
            throw new DeviceFileException(path, keyLine(text, "dialects"),
                    "dialects is an empty list; name at least one (ngspice, spice3, gnucap, xyce), or leave the key out for ngspice and spice3");
        }
        DeviceFile part = check(doc, path);
        if (root.isPresent() && !allowOutsideRoot) {
            confine(part, root.get(), doc, text);
        }
        return part;
    }

    /**
     * Every path the part names (data files, card folder, template folder) must stay inside the library root once
     * symbolic links are resolved: {@code ../../etc/passwd}, {@code /proc/self/environ} and links that lead out are
     * refused, naming the device file, the line and the entry (escaped, shortened).
     */
    private static void confine(DeviceFile part, Path root, Document doc, String text) throws DeviceFileException {
        Path inside = org.cardwright.workflow.OutputPlan.located(root);
        for (DataSource s : part.data()) {
            refuseOutside(part, inside, root, s.resolve(part.folder()), s.line(), "data file", s.file());
        }
        if (doc.cards() != null) {
            refuseOutside(part, inside, root, part.cardFolder(), doc.cards().line(), "cards folder", part.cards());
        }
        if (part.templates().isPresent()) {
            int line = doc.templates() == null ? keyLine(text, "templates") : doc.templates().line();
            refuseOutside(part, inside, root, part.folder().resolve(part.templates().get()), line, "templates folder",
                    part.templates().get());
        }
    }

    private static void refuseOutside(DeviceFile part, Path inside, Path root, Path target, int line, String what,
                                      String entry) throws DeviceFileException {
        Path real = org.cardwright.workflow.OutputPlan.located(target);
        if (!real.startsWith(inside)) {
            throw new DeviceFileException(part.path(), line, what + " " + Excerpts.quoted(entry)
                    + " leads outside the library root " + root.toString().replace('\\', '/')
                    + "; refused (pass --allow-outside-root to allow paths outside the root)");
        }
    }

    private static DeviceFile check(Document doc, Path path) throws DeviceFileException {
        if (doc.model() == null) {
            throw new DeviceFileException(path, 1, "missing key 'model' (the model name on the cards)");
        }
        String model = doc.model().text().trim();
        if (!org.cardwright.card.ModelCard.isSpiceIdentifier(model)) {
            throw new DeviceFileException(path, doc.model().line(),
                    "model name is not a SPICE identifier (a letter, then letters, digits, _ . - +): " + Excerpts.quoted(model));
        }
        DeviceKind kind = DeviceKind.SILICON_PN;
        if (doc.kind() != null) {
            try {
                kind = DeviceKind.byOptionName(doc.kind().text());
            } catch (IllegalArgumentException e) {
                throw new DeviceFileException(path, doc.kind().line(), e.getMessage());
            }
        }
        if (doc.data() == null || doc.data().isEmpty()) {
            throw new DeviceFileException(path, 1, "missing key 'data' (the measurement files, at least one)");
        }
        List<DataSource> data = new ArrayList<>();
        Set<String> seen = new HashSet<>();
        for (DataEntry e : doc.data()) {
            if (e == null || e.file() == null || e.file().text().isBlank()) {
                int at = e == null ? 0 : firstLine(e);
                throw new DeviceFileException(path, at, "a data entry needs 'file'");
            }
            String file = e.file().text().trim().replace('\\', '/');
            if (!seen.add(file)) {
                throw new DeviceFileException(path, e.file().line(), "data file listed twice: " + Excerpts.quoted(file));
            }
            DataKindName dk = DataKindName.FORWARD;
            if (e.kind() != null) {
                dk = DataKindName.bySpelling(e.kind().text()).orElseThrow(() -> new DeviceFileException(path,
                        e.kind().line(), "unknown data kind " + Excerpts.quoted(e.kind().text()) + "; choose one of "
                                + DataKindName.spellings()));
            }
            OptionalDouble temperature = OptionalDouble.empty();
            if (e.temperature() != null) {
                double c = number(path, e.temperature(), "temperature");
                double k = c + Ngspice39.CELSIUS_TO_KELVIN;
                if (!(k > 0)) {
                    throw new DeviceFileException(path, e.temperature().line(),
                            "temperature is below absolute zero: " + Excerpts.quoted(e.temperature().text()) + " degC");
                }
                temperature = OptionalDouble.of(k);
            }
            Map<String, String> options = new LinkedHashMap<>();
            Set<org.cardwright.data.Condition> given = new HashSet<>();
            if (e.options() != null) {
                for (Map.Entry<String, Located> o : e.options().entrySet()) {
                    int at = o.getValue() == null ? e.file().line() : o.getValue().line();
                    java.util.Set<org.cardwright.data.Condition> allowedHere = dk.conditions();
                    java.util.Optional<org.cardwright.data.Condition> c = org.cardwright.data.Condition.byKey(o.getKey())
                            .filter(allowedHere::contains);
                    if (c.isEmpty()) {
                        String allowed = dk.conditions().stream().map(org.cardwright.data.Condition::optionName)
                                .collect(Collectors.joining(", "));
                        throw new DeviceFileException(path, at, "unknown option " + Excerpts.quoted(o.getKey()) + " for "
                                + dk.spelling() + " data: " + (allowed.isEmpty() ? "this kind takes no options"
                                : "this kind takes " + allowed)
                                + (o.getKey().trim().equalsIgnoreCase("temperature") ? " (the entry's own key 'temperature' gives it)" : ""));
                    }
                    if (!given.add(c.get())) {
                        throw new DeviceFileException(path, at, "option " + c.get().optionName() + " given twice");
                    }
                    String value = o.getValue() == null ? "" : o.getValue().text();
                    try {
                        c.get().parse(value);
                    } catch (IllegalArgumentException ex) {
                        throw new DeviceFileException(path, at, "option " + Excerpts.quoted(o.getKey()) + ": "
                                + ex.getMessage());
                    }
                    options.put(c.get().optionName(), value.trim());
                }
            }
            data.add(new DataSource(file, dk, temperature, options, e.file().line()));
        }
        List<ParameterRule> rules = new ArrayList<>();
        Set<org.cardwright.model.Param> ruled = new HashSet<>();
        for (Located r : doc.rules() == null ? List.<Located>of() : doc.rules()) {
            ParameterRule rule;
            try {
                rule = ParameterRule.parse(r.text().trim(), SpiceNumbers::parse);
            } catch (IllegalArgumentException ex) {
                throw new DeviceFileException(path, r.line(), ex.getMessage());
            }
            if (!ruled.add(rule.param())) {
                throw new DeviceFileException(path, r.line(), "a second rule for " + rule.param() + ": " + Excerpts.quoted(r.text()));
            }
            rules.add(rule);
        }
        List<Dialect> dialects = new ArrayList<>();
        if (doc.dialects() == null || doc.dialects().isEmpty()) {
            dialects.add(Dialect.NGSPICE);
            dialects.add(Dialect.SPICE3);
        } else {
            for (Located d : doc.dialects()) {
                Dialect dialect;
                try {
                    dialect = Dialect.byName(d.text());
                } catch (IllegalArgumentException ex) {
                    throw new DeviceFileException(path, d.line(), ex.getMessage());
                }
                if (dialects.contains(dialect)) {
                    throw new DeviceFileException(path, d.line(), "dialect listed twice: " + Excerpts.quoted(d.text()));
                }
                dialects.add(dialect);
            }
        }
        int digits = DeviceFile.DEFAULT_DIGITS;
        if (doc.digits() != null) {
            try {
                digits = Integer.parseInt(doc.digits().text().trim());
            } catch (NumberFormatException ex) {
                throw new DeviceFileException(path, doc.digits().line(), "digits is not a whole number: " + Excerpts.quoted(doc.digits().text()));
            }
            if (digits < 4 || digits > 15) {
                throw new DeviceFileException(path, doc.digits().line(), "digits must lie in 4..15, got " + digits);
            }
        }
        String cards = doc.cards() == null ? "." : relative(path, doc.cards(), "cards");
        Optional<String> templates = doc.templates() == null ? Optional.empty()
                : Optional.of(relative(path, doc.templates(), "templates"));
        PartTolerances tolerances = tolerances(path, doc.tolerance());
        Optional<Tweak> tweak = tweak(path, doc.tweak());
        try {
            return new DeviceFile(path, model, kind, data, rules, dialects, digits, cards, templates, tolerances, tweak);
        } catch (IllegalArgumentException ex) {
            throw new DeviceFileException(path, 1, ex.getMessage());
        }
    }

    private static Optional<Tweak> tweak(Path path, TweakEntry t) throws DeviceFileException {
        if (t == null) {
            return Optional.empty();
        }
        if (t.set() == null) {
            throw new DeviceFileException(path, t.then() == null ? 0 : t.then().line(),
                    "a tweak needs 'set' (e.g. set: RS=+10%)");
        }
        boolean refit = true;
        if (t.then() != null) {
            String then = t.then().text().trim().toLowerCase(java.util.Locale.ROOT);
            if (!then.equals("refit") && !then.equals("render")) {
                throw new DeviceFileException(path, t.then().line(), "tweak 'then' must be refit or render, got '"
                        + t.then().text() + "'");
            }
            refit = then.equals("refit");
        }
        try {
            return Optional.of(Tweak.parse(t.set().text(), refit));
        } catch (IllegalArgumentException e) {
            throw new DeviceFileException(path, t.set().line(), e.getMessage());
        }
    }

    private static PartTolerances tolerances(Path path, ToleranceEntry t) throws DeviceFileException {
        PartTolerances d = PartTolerances.DEFAULT;
        if (t == null) {
            return d;
        }
        double rms = t.forwardRms() == null ? d.forward().rms() : positive(path, t.forwardRms(), "forward-rms-mv") * 1e-3;
        double max = t.forwardMax() == null ? d.forward().max() : positive(path, t.forwardMax(), "forward-max-mv") * 1e-3;
        double leak = d.leakageFactor();
        if (t.leakageFactor() != null) {
            leak = number(path, t.leakageFactor(), "leakage-factor");
            if (!(leak > 1)) {
                throw new DeviceFileException(path, t.leakageFactor().line(),
                        "leakage-factor must be above 1 (a ratio), got " + Excerpts.quoted(t.leakageFactor().text()));
            }
        }
        double cap = t.capacitance() == null ? d.capacitanceRelative() : positive(path, t.capacitance(), "capacitance-percent") / 100;
        double bv = t.breakdown() == null ? d.breakdownRelative() : positive(path, t.breakdown(), "breakdown-percent") / 100;
        return new PartTolerances(new Tolerance(rms, max), leak, cap, bv);
    }

    private static double positive(Path path, Located v, String key) throws DeviceFileException {
        double x = number(path, v, key);
        if (!(x > 0)) {
            throw new DeviceFileException(path, v.line(), key + " must be positive, got " + Excerpts.quoted(v.text()));
        }
        return x;
    }

    private static double number(Path path, Located v, String key) throws DeviceFileException {
        try {
            double x = Double.parseDouble(v.text().trim());
            if (!Double.isFinite(x)) {
                throw new NumberFormatException();
            }
            return x;
        } catch (NumberFormatException e) {
            throw new DeviceFileException(path, v.line(), key + " is not a number: " + Excerpts.quoted(v.text()));
        }
    }

    private static String relative(Path path, Located v, String key) throws DeviceFileException {
        String s = v.text().trim().replace('\\', '/');
        if (s.isEmpty() || s.startsWith("/") || s.matches("^[A-Za-z]:.*")) {
            throw new DeviceFileException(path, v.line(), key + " must be a folder relative to the device file, got " + Excerpts.quoted(v.text()));
        }
        return s;
    }

    private static int firstLine(DataEntry e) {
        for (Located l : new Located[] {e.file(), e.kind(), e.temperature()}) {
            if (l != null) {
                return l.line();
            }
        }
        return 0;
    }

    private static int line(JsonLocation location) {
        return location == null || location.getLineNr() < 0 ? 0 : location.getLineNr();
    }

    private static String pathText(JsonMappingException e) {
        StringBuilder sb = new StringBuilder();
        for (JsonMappingException.Reference r : e.getPath()) {
            if (r.getFieldName() != null) {
                sb.append(sb.length() == 0 ? "" : ".").append(r.getFieldName());
            } else if (r.getIndex() >= 0) {
                sb.append('[').append(r.getIndex() + 1).append(']');
            }
        }
        return sb.toString();
    }

    private static String where(JsonMappingException e) {
        List<JsonMappingException.Reference> refs = e.getPath();
        if (refs.size() <= 1) {
            return "";
        }
        StringBuilder sb = new StringBuilder();
        for (JsonMappingException.Reference r : refs.subList(0, refs.size() - 1)) {
            if (r.getFieldName() != null) {
                sb.append(sb.length() == 0 ? "" : ".").append(r.getFieldName());
            } else if (r.getIndex() >= 0) {
                sb.append('[').append(r.getIndex() + 1).append(']');
            }
        }
        return " under '" + sb + "'";
    }

    private static String expected(Class<?> type) {
        if (type == null) {
            return "another form";
        }
        if (List.class.isAssignableFrom(type)) {
            return "a list ('- item' lines)";
        }
        if (type == Located.class) {
            return "a single value";
        }
        return "a mapping ('key: value' lines)";
    }

    private static String firstLine(String message) {
        if (message == null) {
            return "malformed YAML";
        }
        String m = message.strip();
        int end = m.indexOf('\n');
        return end < 0 ? m : m.substring(0, end);
    }
}
