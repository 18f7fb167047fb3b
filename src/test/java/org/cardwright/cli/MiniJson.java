package org.cardwright.cli;

import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.DeserializationFeature;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.json.JsonMapper;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * A strict JSON reader (RFC 8259) for tests, so that the machine-readable output is checked by a parser we did not
 * use to write it (our writer is report/Json; this reader is Jackson, with trailing tokens and duplicate keys
 * refused on top of its strict defaults). Objects become {@link LinkedHashMap}, arrays {@link List}, numbers
 * {@link Double}, and {@code true}/{@code false}/{@code null} {@link Boolean} or null. Anything else is an
 * {@link IllegalArgumentException} with Jackson's message.
 */
final class MiniJson {
    private static final ObjectMapper MAPPER = JsonMapper.builder()
            .enable(DeserializationFeature.FAIL_ON_TRAILING_TOKENS)
            .enable(JsonParser.Feature.STRICT_DUPLICATE_DETECTION)
            .build();

    private MiniJson() {
    }

    /** Parses one JSON value filling the whole text (surrounding white space allowed). */
    static Object parse(String text) {
        JsonNode node;
        try {
            node = MAPPER.readTree(text);
        } catch (JsonProcessingException e) {
            throw new IllegalArgumentException(e.getOriginalMessage(), e);
        }
        if (node == null || node.isMissingNode()) {
            throw new IllegalArgumentException("no JSON value in the text");
        }
        return plain(node);
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

    private static Object plain(JsonNode node) {
        if (node.isObject()) {
            Map<String, Object> map = new LinkedHashMap<>();
            for (Iterator<Map.Entry<String, JsonNode>> it = node.fields(); it.hasNext(); ) {
                Map.Entry<String, JsonNode> e = it.next();
                map.put(e.getKey(), plain(e.getValue()));
            }
            return map;
        }
        if (node.isArray()) {
            List<Object> list = new ArrayList<>(node.size());
            for (JsonNode n : node) {
                list.add(plain(n));
            }
            return list;
        }
        if (node.isNumber()) {
            return node.doubleValue();
        }
        if (node.isTextual()) {
            return node.textValue();
        }
        if (node.isBoolean()) {
            return node.booleanValue();
        }
        if (node.isNull()) {
            return null;
        }
        throw new IllegalArgumentException("not a JSON value: " + node.getNodeType());
    }
}
