package org.cardwright.report;

import static org.junit.jupiter.api.Assertions.assertEquals;

import com.fasterxml.jackson.databind.DeserializationFeature;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.math.BigDecimal;
import java.math.BigInteger;
import java.util.Map;
import org.junit.jupiter.api.Test;

/**
 * Issue 11, "In the code": the hand JSON writer keeps every number whole. A BigDecimal was cut to a long (1.5 became
 * 1); now it is written exactly, as Jackson (the reference reader here) reads it back.
 */
class JsonNumbersTest {
    private static final ObjectMapper READER = new ObjectMapper().enable(DeserializationFeature.USE_BIG_DECIMAL_FOR_FLOATS);

    @Test
    void everyKindOfNumberIsWrittenExactly() throws Exception {
        Map<String, Object> o = Json.object();
        o.put("half", new BigDecimal("1.5"));
        o.put("tiny", new BigDecimal("1.5E-7"));
        o.put("wide", new BigDecimal("12345678901234567890.25"));
        o.put("huge", new BigInteger("123456789012345678901234567890"));
        o.put("long", Long.MAX_VALUE);
        o.put("int", -7);
        o.put("float", 0.25f);
        o.put("atomic", new java.util.concurrent.atomic.AtomicLong(42));
        JsonNode back = READER.readTree(Json.write(o));
        assertEquals(new BigDecimal("1.5"), back.get("half").decimalValue());
        assertEquals(0, new BigDecimal("1.5E-7").compareTo(back.get("tiny").decimalValue()));
        assertEquals(new BigDecimal("12345678901234567890.25"), back.get("wide").decimalValue());
        assertEquals(new BigInteger("123456789012345678901234567890"), back.get("huge").bigIntegerValue());
        assertEquals(Long.MAX_VALUE, back.get("long").longValue());
        assertEquals(-7, back.get("int").intValue());
        assertEquals(0.25, back.get("float").doubleValue());
        assertEquals(42.0, back.get("atomic").doubleValue());
    }
}
