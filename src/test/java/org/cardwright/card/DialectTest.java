package org.cardwright.card;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.EnumSet;
import java.util.List;
import java.util.Optional;
import org.cardwright.model.Param;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * Dialect tables. The parameter lists are those of the simulators' own sources (ngspice 39 dio device table,
 * SPICE3f5 diode model table, gnucap 2017.10.03 d_diode.model); {@link DialectSimulatorTest} asks the installed
 * ngspice and gnucap the same questions.
 */
class DialectTest {
    @Test
    void ngspiceCarriesEveryParameter() {
        assertEquals(EnumSet.allOf(Param.class), Dialect.NGSPICE.carriedParameters());
    }

    @Test
    void spice3CarriesTheClassicSet() {
        assertEquals(EnumSet.of(Param.IS, Param.N, Param.RS, Param.TT, Param.CJO, Param.VJ, Param.M, Param.EG,
                Param.XTI, Param.FC, Param.BV, Param.IBV, Param.TNOM), Dialect.SPICE3.carriedParameters());
    }

    @Test
    void gnucapLeavesOutBreakdownWhichItIgnores() {
        assertEquals(EnumSet.of(Param.IS, Param.N, Param.RS, Param.TT, Param.CJO, Param.VJ, Param.M, Param.EG,
                Param.XTI, Param.FC, Param.TNOM), Dialect.GNUCAP.carriedParameters());
        assertFalse(Dialect.GNUCAP.carries(Param.BV));
        assertTrue(Dialect.GNUCAP.isKnownUnsupported("bv"));
    }

    @ParameterizedTest(name = "{0} reads {1} as {2}")
    @CsvSource({
        "NGSPICE, JS, IS", "NGSPICE, cj, CJO", "NGSPICE, Cj0, CJO", "NGSPICE, pb, VJ", "NGSPICE, MJ, M",
        "NGSPICE, ik, IKF", "NGSPICE, IB, IBV", "NGSPICE, trs, TRS1", "NGSPICE, Tref, TNOM", "NGSPICE, is, IS",
        "NGSPICE, rth0, RTH0", "NGSPICE, ' tnom ', TNOM",
        "SPICE3, CJ0, CJO", "SPICE3, cjo, CJO", "SPICE3, bv, BV",
        "GNUCAP, pb, VJ", "GNUCAP, mj, M", "GNUCAP, EGAP, EG", "GNUCAP, vj, VJ", "GNUCAP, TNOM, TNOM"
    })
    void resolvesNamesAndAliasesInAnyCase(Dialect dialect, String keyword, Param expected) {
        assertEquals(Optional.of(expected), dialect.resolve(keyword));
    }

    @ParameterizedTest(name = "{0} does not read {1}")
    @CsvSource({
        "NGSPICE, FOO", "NGSPICE, TM1", "NGSPICE, EGAP", "NGSPICE, VB", "NGSPICE, TBV1",
        "SPICE3, ISR", "SPICE3, JS", "SPICE3, CJ", "SPICE3, PB", "SPICE3, TRS1",
        "GNUCAP, CJ0", "GNUCAP, JS", "GNUCAP, BV", "GNUCAP, IBV", "GNUCAP, IKF", "GNUCAP, ISR", "GNUCAP, RTH0"
    })
    void doesNotResolveWhatTheSimulatorWouldRejectOrIgnore(Dialect dialect, String keyword) {
        assertEquals(Optional.empty(), dialect.resolve(keyword));
    }

    @Test
    void aliasesOnlyPointAtCarriedParametersAndNeverShadowAParameterName() {
        for (Dialect d : Dialect.values()) {
            d.aliases().forEach((alias, p) -> {
                assertTrue(d.carries(p), d + " alias " + alias);
                assertTrue(Param.byKeyword(alias).isEmpty(), d + " alias " + alias + " is a parameter name");
                assertFalse(d.isKnownUnsupported(alias), d + " alias " + alias + " also listed as unsupported");
            });
            for (Param p : d.carriedParameters()) {
                assertFalse(d.isKnownUnsupported(p.keyword()), d + " carries and lists as unsupported: " + p);
            }
        }
    }

    @Test
    void knownUnsupportedKeywordsIncludeTheBriefsExamples() {
        for (String k : List.of("TM1", "TM2", "TTT1", "TTT2", "TLEVC", "CTA", "CTP", "TPB", "TPHP", "JSW", "NS",
                "CJSW", "PHP", "MJSW", "FCS", "KF", "AF", "AREA", "PJ", "LEVEL")) {
            assertTrue(Dialect.NGSPICE.isKnownUnsupported(k.toLowerCase(java.util.Locale.ROOT)), k);
        }
        assertFalse(Dialect.NGSPICE.isKnownUnsupported("IKR"), "IKR is modelled");
    }

    @Test
    void findsDialectsByNameAndListsTheValidOnesOtherwise() {
        assertEquals(Dialect.NGSPICE, Dialect.byName("ngspice"));
        assertEquals(Dialect.SPICE3, Dialect.byName("SPICE3"));
        assertEquals(Dialect.GNUCAP, Dialect.byName(" GnuCap "));
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> Dialect.byName("hspice"));
        assertEquals("unknown dialect 'hspice'; valid names: ngspice, spice3, gnucap, xyce", e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> Dialect.byName(null));
    }

    @Test
    void eachDialectHasItsOwnTemplate() {
        assertEquals("ngspice.ftl", Dialect.NGSPICE.templateFileName());
        assertEquals("spice3.ftl", Dialect.SPICE3.templateFileName());
        assertEquals("gnucap.ftl", Dialect.GNUCAP.templateFileName());
    }
}
