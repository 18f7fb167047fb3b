package org.cardwright.cli;

import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.DeserializationFeature;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * The tests' strict JSON reader (RFC 8259), on Jackson (already in the build), so that the machine-readable
 * output is checked by a parser we did not use to write it (cardwright writes its JSON by hand, report/Json).
 * Objects become {@link LinkedHashMap}, arrays {@link List}, numbers {@link Double}, and {@code true}/{@code
 * false}/{@code null} {@link Boolean} or null. Duplicate keys, trailing text and everything Jackson's lenient
 * features would allow (comments, single quotes, NaN, leading zeros, trailing commas) are errors.
 */
final class MiniJson {
    private static final ObjectMapper STRICT = new ObjectMapper()
            .enable(JsonParser.Feature.STRICT_DUPLICATE_DETECTION)
            .enable(DeserializationFeature.FAIL_ON_TRAILING_TOKENS);

    private MiniJson() {
    }

    /** Parses one JSON value filling the whole text (surrounding white space allowed). */
    static Object parse(String text) {
        JsonNode node;
        try {
            node = STRICT.readTree(text);
        } catch (JsonProcessingException e) {
            throw new IllegalArgumentException("not JSON: " + e.getOriginalMessage(), e);
        }
        if (node == null || node.isMissingNode()) {
            throw new IllegalArgumentException("no JSON value in the text");
        }
        return plain(node);
    }

    private static Object plain(JsonNode n) {
        if (n.isObject()) {
            Map<String, Object> m = new LinkedHashMap<>();
            n.fields().forEachRemaining(e -> m.put(e.getKey(), plain(e.getValue())));
            return m;
        }
        if (n.isArray()) {
            List<Object> l = new ArrayList<>();
            n.forEach(e -> l.add(plain(e)));
            return l;
        }
        if (n.isNumber()) {
            return n.doubleValue();
        }
        if (n.isBoolean()) {
            return n.booleanValue();
        }
        if (n.isNull()) {
            return null;
        }
        return n.textValue();
    }

    /** The value at a dotted path of object keys, e.g. {@code parameters.IS.value}; fails when absent. */
    static Object at(Object root, String path) {
        Object v = root;
        for (String key : path.split("\\.")) {
            if (!(v instanceof Map<?, ?> m) || !m.containsKey(key)) {
                throw new IllegalArgumentException("no '" + key + "' on the path " + path);
            }
            v = m.get(key);
        }
        return v;
    }
}
