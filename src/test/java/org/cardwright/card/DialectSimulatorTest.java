package org.cardwright.card;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.cardwright.model.Param;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The installed simulators confirm the dialect tables: what we call an alias, supported or unsupported. */
class DialectSimulatorTest {
    /** Relative agreement of a value read by ngspice with ours [1]: a few ulp of ngspice's own number reading. */
    private static final double NGSPICE_READ_TOLERANCE = 1e-14;

    private static final Pattern PRINTED = Pattern.compile("@(\\w+)\\[(\\w+)\\] = (\\S+)");

    /** A value for each parameter that every simulator accepts without a warning, as written on a card. */
    private static final Map<Param, String> SAFE_CARD_VALUES = safeValues();

    /** Values for ngspice keywords cardwright does not model: their ngspice 39 defaults (read from showmod). */
    private static final Map<String, String> NGSPICE_UNSUPPORTED_VALUES = Map.ofEntries(
            Map.entry("LEVEL", "1"), Map.entry("AREA", "1"), Map.entry("PJ", "0"), Map.entry("JSW", "0"),
            Map.entry("NS", "1"), Map.entry("CJSW", "0"), Map.entry("CJP", "0"), Map.entry("PHP", "1"),
            Map.entry("MJSW", "0.33"), Map.entry("FCS", "0.5"), Map.entry("TM1", "0"), Map.entry("TM2", "0"),
            Map.entry("TTT1", "0"), Map.entry("TTT2", "0"), Map.entry("TLEVC", "0"), Map.entry("CTA", "0"),
            Map.entry("CTC", "0"), Map.entry("CTP", "0"), Map.entry("TPB", "0"), Map.entry("TVJ", "0"),
            Map.entry("TPHP", "0"), Map.entry("JTUN", "0"), Map.entry("JTUNSW", "0"), Map.entry("NTUN", "30"),
            Map.entry("XTITUN", "3"), Map.entry("KEG", "1"), Map.entry("KF", "0"), Map.entry("AF", "1"),
            Map.entry("CTH0", "1e-5"), Map.entry("FV_MAX", "1e99"), Map.entry("BV_MAX", "1e99"),
            Map.entry("ID_MAX", "1e99"), Map.entry("PD_MAX", "1e99"), Map.entry("TE_MAX", "1e99"),
            Map.entry("LM", "0"), Map.entry("LP", "0"), Map.entry("WM", "0"), Map.entry("WP", "0"),
            Map.entry("XOM", "1e-6"), Map.entry("XOI", "1e-6"), Map.entry("XM", "0"), Map.entry("XP", "0"));

    @TempDir
    Path folder;

    private static Map<Param, String> safeValues() {
        Map<Param, String> v = new EnumMap<>(Param.class);
        v.put(Param.IS, "2.5n");
        v.put(Param.N, "1.8");
        v.put(Param.RS, "50m");
        v.put(Param.ISR, "1p");
        v.put(Param.NR, "2");
        v.put(Param.IKF, "10m");
        v.put(Param.IKR, "1m");
        v.put(Param.EG, "1.11");
        v.put(Param.XTI, "3");
        v.put(Param.TRS1, "1m");
        v.put(Param.TRS2, "1u");
        v.put(Param.CJO, "200p");
        v.put(Param.VJ, "0.6");
        v.put(Param.M, "0.45");
        v.put(Param.FC, "0.5");
        v.put(Param.TT, "5u");
        v.put(Param.BV, "100");
        v.put(Param.IBV, "5u");
        v.put(Param.NBV, "2");
        v.put(Param.TCV, "50m");
        v.put(Param.TLEV, "1");
        v.put(Param.RTH0, "100");
        v.put(Param.TNOM, "25");
        return v;
    }

    @Test
    void ngspiceReadsEveryAliasAsTheParameterWeMapItTo() throws Exception {
        ExternalSimulator ngspice = ExternalSimulator.ngspice();
        StringBuilder deck = new StringBuilder("alias check\nV1 a 0 0.6\n");
        StringBuilder print = new StringBuilder();
        List<String> aliases = new ArrayList<>(Dialect.NGSPICE.aliases().keySet());
        for (int i = 0; i < aliases.size(); i++) {
            Param p = Dialect.NGSPICE.aliases().get(aliases.get(i));
            deck.append(".model al").append(i).append(" D(").append(aliases.get(i)).append('=')
                    .append(SAFE_CARD_VALUES.get(p)).append(")\nD").append(i).append(" a 0 al").append(i).append('\n');
            print.append("print @al").append(i).append('[').append(p.keyword().toLowerCase(Locale.ROOT)).append("]\n");
        }
        Map<String, Double> printed = run(ngspice, deck, print);
        for (int i = 0; i < aliases.size(); i++) {
            Param p = Dialect.NGSPICE.aliases().get(aliases.get(i));
            Double value = printed.get("al" + i);
            assertNotNull(value, "ngspice printed nothing for alias " + aliases.get(i));
            double ours = SpiceNumbers.parse(SAFE_CARD_VALUES.get(p));
            assertEquals(ours, value, Math.abs(ours) * NGSPICE_READ_TOLERANCE, aliases.get(i) + " -> " + p);
        }
    }

    @Test
    void ngspiceAcceptsEveryCarriedAndEveryKnownUnsupportedKeywordWithoutWarning() throws Exception {
        ExternalSimulator ngspice = ExternalSimulator.ngspice();
        StringBuilder card = new StringBuilder(".model all D(\n");
        SAFE_CARD_VALUES.forEach((p, v) -> card.append("+ ").append(p.keyword()).append('=').append(v).append('\n'));
        for (String k : Dialect.NGSPICE.knownUnsupportedKeywords()) {
            String value = NGSPICE_UNSUPPORTED_VALUES.get(k);
            assertNotNull(value, "no safe test value for " + k + "; add one to the table");
            card.append("+ ").append(k).append('=').append(value).append('\n');
        }
        card.append("+ )\n");
        StringBuilder deck = new StringBuilder("keyword check\nV1 a 0 0.6\n").append(card).append("D1 a 0 all\n");
        run(ngspice, deck, new StringBuilder("print @all[is]\n"));
    }

    @Test
    void ngspiceWarnsAboutAKeywordWeCallUnknown() throws Exception {
        // negative control: the warning check above can fail; VB is an Xyce name that ngspice 39 rejects
        ExternalSimulator ngspice = ExternalSimulator.ngspice();
        Path file = folder.resolve("unknown.cir");
        Files.writeString(file, "unknown keyword\nV1 a 0 0.6\n.model dvb D(IS=1n VB=3)\nD1 a 0 dvb\n.op\n.end\n",
                StandardCharsets.UTF_8);
        String output = ngspice.runBatch(file).toLowerCase(Locale.ROOT);
        assertTrue(output.contains("unrecognized parameter (vb)"), output);
        assertTrue(Dialect.NGSPICE.resolve("VB").isEmpty() && !Dialect.NGSPICE.isKnownUnsupported("VB"));
    }

    @Test
    void gnucapAcceptsWhatWeWriteOrReadAndRejectsWhatWeLeaveOut() throws Exception {
        ExternalSimulator gnucap = ExternalSimulator.gnucap();
        StringBuilder carried = new StringBuilder();
        for (Param p : Dialect.GNUCAP.carriedParameters()) {
            carried.append(' ').append(p.keyword().toLowerCase(Locale.ROOT)).append('=').append(SAFE_CARD_VALUES.get(p));
        }
        StringBuilder aliases = new StringBuilder();
        Dialect.GNUCAP.aliases().forEach((alias, p) ->
                aliases.append(' ').append(alias.toLowerCase(Locale.ROOT)).append('=').append(SAFE_CARD_VALUES.get(p)));
        StringBuilder unsupported = new StringBuilder();
        for (String k : Dialect.GNUCAP.knownUnsupportedKeywords()) {
            unsupported.append(' ').append(k.toLowerCase(Locale.ROOT)).append('=')
                    .append(k.equals("BV") ? "100" : k.equals("IBV") ? "1m" : k.equals("AF") ? "1" : "0");
        }
        List<String> rejected = new ArrayList<>();
        StringBuilder notCarried = new StringBuilder();
        for (Param p : Param.values()) {
            if (!Dialect.GNUCAP.carries(p) && !Dialect.GNUCAP.isKnownUnsupported(p.keyword())) {
                rejected.add(p.keyword().toLowerCase(Locale.ROOT));
                notCarried.append(' ').append(p.keyword().toLowerCase(Locale.ROOT)).append('=')
                        .append(SAFE_CARD_VALUES.get(p));
            }
        }
        String deck = "gnucap keyword check\n"
                + ".model dcar d (" + carried + ")\n"
                + ".model dali d (" + aliases + ")\n"
                + ".model duns d (" + unsupported + ")\n"
                + ".model dnot d (" + notCarried + ")\n"
                + "I1 0 a dc 1m\nD1 a 0 dcar\nI2 0 b dc 1m\nD2 b 0 dali\nI3 0 c dc 1m\nD3 c 0 duns\n"
                + "I4 0 e dc 1m\nD4 e 0 dnot\n.print op v(a)\n.op 27\n.end\n";
        Path file = folder.resolve("keywords.ckt");
        Files.writeString(file, deck, StandardCharsets.UTF_8);
        String output = gnucap.runBatch(file);
        for (String k : rejected) {
            assertTrue(output.contains("dnot: bad parameter " + k + " ignored"), k + " should be rejected:\n" + output);
        }
        for (String model : List.of("dcar", "dali", "duns")) {
            assertTrue(!output.contains(model + ": bad parameter"), model + ":\n" + output);
        }
    }

    private Map<String, Double> run(ExternalSimulator ngspice, StringBuilder deck, StringBuilder print)
            throws Exception {
        deck.append(".control\nset numdgt=15\nop\n").append(print).append("quit\n.endc\n.end\n");
        Path file = folder.resolve("deck.cir");
        Files.writeString(file, deck, StandardCharsets.UTF_8);
        String output = ngspice.runBatch(file);
        ExternalSimulator.assertNoneOf(output, List.of("warning", "unrecognized", "error"), "dialect deck");
        Map<String, Double> printed = new HashMap<>();
        Matcher m = PRINTED.matcher(output);
        while (m.find()) {
            printed.put(m.group(1).toLowerCase(Locale.ROOT), Double.parseDouble(m.group(3)));
        }
        assertTrue(!printed.isEmpty(), "ngspice printed no values:\n" + output);
        return printed;
    }
}
