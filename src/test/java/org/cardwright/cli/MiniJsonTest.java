package org.cardwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.Arrays;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

/** The test-side JSON reader must accept what RFC 8259 allows and refuse what it does not, or its checks mean little. */
class MiniJsonTest {

    @Test
    void readsEveryKindOfValue() {
        Object v = MiniJson.parse(" {\"a\": [1, -2.5e-3, 0, true, false, null], \"b\": {\"c\": \"x\\\"y\\u00b5\\n\"}} ");
        assertEquals(Map.of("a", Arrays.asList(1.0, -2.5e-3, 0.0, true, false, null), "b", Map.of("c", "x\"y\u00b5\n")), v);
        assertEquals("x\"y\u00b5\n", MiniJson.at(v, "b.c"));
        assertEquals(List.of(), MiniJson.parse("[]"));
        assertEquals(1.5E-14, MiniJson.parse("1.5E-14"));
    }

    @Test
    void refusesWhatIsNotJson() {
        for (String bad : List.of("{\"a\":1,}", "[1,]", "{'a':1}", "01", "1.", ".5", "NaN", "{\"a\":1}{", "\"tab\there\"",
                "{\"a\":1,\"a\":2}", "[1 2]", "", "tru")) {
            assertThrows(IllegalArgumentException.class, () -> MiniJson.parse(bad), bad);
        }
        assertThrows(IllegalArgumentException.class, () -> MiniJson.at(MiniJson.parse("{\"a\":{}}"), "a.b"));
    }
}
