package org.cardwright.card;

import java.util.Arrays;
import java.util.Collections;
import java.util.EnumSet;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.stream.Collectors;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.Param;

/**
 * A simulator's flavour of the diode {@code .model} card: which cardwright parameters it carries, the spellings it
 * accepts when reading, the keywords it knows that cardwright does not model, and the template that writes it.
 *
 * <p>The keyword tables come from the simulators' public sources (ngspice 39 {@code src/spicelib/devices/dio},
 * gnucap 2017.10.03 {@code apps/d_diode.model}, SPICE3f5) and were checked by loading cards into the installed
 * ngspice 39 and gnucap; {@code DialectSimulatorTest} repeats that check.
 *
 * <p>Inside the program every parameter has its ngspice 39 meaning. Where a simulator gives the same keyword
 * another meaning, {@link #toCard} converts a value on its way onto the card and {@link #fromCard} converts it
 * back when a card is read; today that is only gnucap's XTI (see {@link #GNUCAP}). docs/dialects.md lists what
 * each simulator does differently, converted or not.
 */
public enum Dialect {
    /** ngspice 39, junction diode level 1: every parameter cardwright models. */
    NGSPICE("ngspice", "ngspice 39 (diode level 1)", "ngspice.ftl",
            EnumSet.allOf(Param.class),
            Map.of("JS", Param.IS, "CJ", Param.CJO, "CJ0", Param.CJO, "PB", Param.VJ, "MJ", Param.M,
                    "IK", Param.IKF, "IB", Param.IBV, "TRS", Param.TRS1, "TREF", Param.TNOM),
            List.of("LEVEL", "AREA", "PJ", "JSW", "NS", "CJSW", "CJP", "PHP", "MJSW", "FCS",
                    "TM1", "TM2", "TTT1", "TTT2", "TLEVC", "CTA", "CTC", "CTP", "TPB", "TVJ", "TPHP",
                    "JTUN", "JTUNSW", "NTUN", "XTITUN", "KEG", "KF", "AF", "CTH0",
                    "FV_MAX", "BV_MAX", "ID_MAX", "PD_MAX", "TE_MAX",
                    "LM", "LP", "WM", "WP", "XOM", "XOI", "XM", "XP")),
    /** Berkeley SPICE3f5 diode: the classic parameter set. */
    SPICE3("spice3", "SPICE3f5", "spice3.ftl",
            EnumSet.of(Param.IS, Param.N, Param.RS, Param.TT, Param.CJO, Param.VJ, Param.M, Param.EG,
                    Param.XTI, Param.FC, Param.BV, Param.IBV, Param.TNOM),
            Map.of("CJ0", Param.CJO),
            List.of("KF", "AF")),
    /**
     * gnucap 2017.10.03 diode. gnucap accepts BV and IBV but ignores them, so they are not carried: a card never
     * holds a parameter its simulator would silently ignore.
     *
     * <p>gnucap raises T/Tnom to the power XTI in its saturation-current law where ngspice raises it to XTI/N, so
     * a gnucap card carries XTI/N under the keyword XTI (and a card read back gives XTI = N times the written
     * value). Not convertible, and therefore different away from TNOM: gnucap's older k and q, its missing
     * temperature scaling of CJO and VJ, its missing GMIN and breakdown (see docs/dialects.md).
     */
    GNUCAP("gnucap", "gnucap 2017.10.03", "gnucap.ftl",
            EnumSet.of(Param.IS, Param.N, Param.RS, Param.TT, Param.CJO, Param.VJ, Param.M, Param.EG,
                    Param.XTI, Param.FC, Param.TNOM),
            Map.of("PB", Param.VJ, "MJ", Param.M, "EGAP", Param.EG),
            List.of("BV", "IBV", "KF", "AF", "CJSW", "CJS", "PBSW", "PBS", "MJSW", "MJS",
                    "GPARALLEL", "GP", "FLAGS", "MOS_LEVEL")),
    /**
     * Xyce 7.7 or later, diode level 1 (from 7.6 level 1 takes ISR, NR, IKF and the RS and BV temperature
     * coefficients, earlier releases reject them; NBV acts only from 7.7 on). Read from Xyce's source as recorded in
     * shared/reference/diode-model.md section 8; Xyce is not packaged for Debian, so no card is run in Xyce here.
     *
     * <p>Xyce states the breakdown temperature law as BV(1 + TBV1 dT), so ngspice's TCV (BV - TCV dT, TLEV 0)
     * goes on the card as TBV1 = -TCV/BV; Xyce's NR defaults to 2, so a card with ISR always states NR. Its
     * high-injection law and constants differ from ngspice's: a card is fitted with Xyce's own equations
     * ({@link #flavour()}).
     */
    XYCE("xyce", "Xyce 7.7 or later (diode level 1)", "xyce.ftl",
            EnumSet.of(Param.IS, Param.N, Param.RS, Param.ISR, Param.NR, Param.IKF, Param.EG, Param.XTI,
                    Param.TRS1, Param.TRS2, Param.CJO, Param.VJ, Param.M, Param.FC, Param.TT, Param.BV, Param.IBV,
                    Param.NBV, Param.TCV, Param.TNOM),
            Map.of("JS", Param.IS, "CJ", Param.CJO, "CJ0", Param.CJO, "VB", Param.BV, "TRS", Param.TRS1,
                    "TBV1", Param.TCV),
            List.of("LEVEL", "AREA", "KF", "AF", "TBV2", "TIKF", "IBVL", "NBVL", "JSW", "NS", "CJSW", "CJP",
                    "PHP", "VJSW", "MJSW", "FCS", "IRF", "LAMBERTW"));

    /**
     * The XTI gnucap 2017.10.03 uses when a card gives none [1]. Checked by running: a card without XTI and one
     * with XTI=3 give the same forward voltage at 125 degC ({@code GnucapCardTest}).
     */
    static final double GNUCAP_DEFAULT_XTI = 3.0;
    /** Xyce's NR when a card gives ISR without NR (reference section 8) [1]. */
    static final double XYCE_DEFAULT_NR = 2.0;

    /** The keyword this dialect writes for {@code p}: Xyce states the BV temperature coefficient as TBV1. */
    public String keyword(Param p) {
        return this == XYCE && p == Param.TCV ? "TBV1" : p.keyword();
    }

    /** Whose equations a card in this dialect is evaluated with, and so fitted with. */
    public org.cardwright.model.Flavour flavour() {
        return switch (this) {
            case NGSPICE -> org.cardwright.model.Flavour.NGSPICE_39;
            case SPICE3 -> org.cardwright.model.Flavour.SPICE3F5;
            case GNUCAP -> org.cardwright.model.Flavour.GNUCAP_2017;
            case XYCE -> org.cardwright.model.Flavour.XYCE;
        };
    }

    private final String shortName;
    private final String simulator;
    private final String templateFileName;
    private final Set<Param> carried;
    private final Map<String, Param> aliases;
    private final Set<String> knownUnsupported;

    Dialect(String shortName, String simulator, String templateFileName, EnumSet<Param> carried,
            Map<String, Param> aliases, List<String> knownUnsupported) {
        this.shortName = shortName;
        this.simulator = simulator;
        this.templateFileName = templateFileName;
        this.carried = Collections.unmodifiableSet(carried);
        this.aliases = Collections.unmodifiableMap(new LinkedHashMap<>(aliases));
        this.knownUnsupported = Collections.unmodifiableSet(new LinkedHashSet<>(knownUnsupported));
    }

    /** The name used on the command line and in {@link #byName}, lower case. */
    public String shortName() {
        return shortName;
    }

    /** The simulator and version this dialect describes, for messages and reports. */
    public String simulator() {
        return simulator;
    }

    /** The template file that writes this dialect, looked up in the user's folder first, then the bundled one. */
    public String templateFileName() {
        return templateFileName;
    }

    /** The parameters a card in this dialect carries, in {@link Param} order. */
    public Set<Param> carriedParameters() {
        return carried;
    }

    /** Alternative keywords (upper case) that this simulator reads as a carried parameter. */
    public Map<String, Param> aliases() {
        return aliases;
    }

    /**
     * Keywords (upper case) this simulator accepts on a diode card that cardwright does not model, or that the
     * simulator accepts but ignores. A reader reports them and their values as notices.
     */
    public Set<String> knownUnsupportedKeywords() {
        return knownUnsupported;
    }

    /** True when a card in this dialect carries {@code parameter}. */
    public boolean carries(Param parameter) {
        return carried.contains(parameter);
    }

    /**
     * The carried parameter a keyword names in this dialect, by its canonical name or an alias, in any letter case.
     * Empty for keywords this dialect does not read as a cardwright parameter.
     */
    public Optional<Param> resolve(String keyword) {
        String k = keyword.trim().toUpperCase(Locale.ROOT);
        Param alias = aliases.get(k);
        if (alias != null) {
            return Optional.of(alias);
        }
        return Param.byKeyword(k).filter(this::carries);
    }

    /** True when {@code keyword} (any case) is in {@link #knownUnsupportedKeywords()}. */
    public boolean isKnownUnsupported(String keyword) {
        return knownUnsupported.contains(keyword.trim().toUpperCase(Locale.ROOT));
    }

    /**
     * The values a card in this dialect must state so that its simulator computes what ngspice 39 computes from
     * {@code ngspiceMeaning}, as far as a value can do that. Identity for ngspice and SPICE3f5 (whose XTI
     * already enters as XTI/N). For gnucap: XTI becomes XTI/N, and it is stated whenever N differs from 1, even
     * when not given, because gnucap's own default (XTI = 3 on T/Tnom) would mean ngspice XTI = 3N.
     *
     * @param ngspiceMeaning parameters in ngspice 39 meaning [SI]
     * @return the values to write on the card [SI]
     */
    public DiodeParameters toCard(DiodeParameters ngspiceMeaning) {
        if (this == XYCE) {
            DiodeParameters p = ngspiceMeaning;
            if (p.isGiven(Param.TCV) && p.isGiven(Param.BV)) {
                double tcv = p.get(Param.TCV);
                p = p.with(Param.TCV, p.get(Param.TLEV) == 0 ? -tcv / p.get(Param.BV) : -tcv);
            }
            if (p.isGiven(Param.ISR) && !p.isGiven(Param.NR)) {
                p = p.with(Param.NR, Param.NR.defaultValue());
            }
            return p.without(Param.TLEV);
        }
        if (this != GNUCAP) {
            return ngspiceMeaning;
        }
        double n = ngspiceMeaning.get(Param.N);
        if (!ngspiceMeaning.isGiven(Param.XTI) && n == 1) {
            return ngspiceMeaning;
        }
        return ngspiceMeaning.with(Param.XTI, ngspiceMeaning.get(Param.XTI) / n);
    }

    /**
     * The ngspice 39 meaning of the values a card in this dialect states; the inverse of {@link #toCard}.
     * Identity for ngspice and SPICE3f5. For gnucap: XTI = N times the card's XTI; a gnucap card with N other
     * than 1 and no XTI means gnucap's default XTI = 3, so XTI = 3N in ngspice meaning, given from then on.
     *
     * @param cardValues the values as written on the card [SI]
     * @return the same parameters in ngspice 39 meaning [SI]
     */
    public DiodeParameters fromCard(DiodeParameters cardValues) {
        if (this == XYCE) {
            DiodeParameters p = cardValues;
            if (p.isGiven(Param.TCV)) {
                // the card's TBV1, relative to BV; without BV it has nothing to act on
                p = p.isGiven(Param.BV) ? p.with(Param.TCV, -p.get(Param.TCV) * p.get(Param.BV)) : p.without(Param.TCV);
            }
            if (p.isGiven(Param.ISR) && !p.isGiven(Param.NR)) {
                p = p.with(Param.NR, XYCE_DEFAULT_NR);
            }
            return p;
        }
        if (this != GNUCAP) {
            return cardValues;
        }
        double n = cardValues.get(Param.N);
        if (cardValues.isGiven(Param.XTI)) {
            return cardValues.with(Param.XTI, cardValues.get(Param.XTI) * n);
        }
        return n == 1 ? cardValues : cardValues.with(Param.XTI, GNUCAP_DEFAULT_XTI * n);
    }

    /**
     * The values a card in this dialect states for {@code ngspiceMeaning}: keyword and number as written on the card
     * (after {@link #toCard}; TNOM in degrees C), for every given parameter the dialect carries, in {@link Param}
     * order. What {@link CardWriter} formats, and what a simulator deck is written from.
     */
    public Map<String, Double> statedValues(DiodeParameters ngspiceMeaning) {
        DiodeParameters onCard = toCard(ngspiceMeaning);
        Map<String, Double> out = new LinkedHashMap<>();
        for (Param p : Param.values()) {
            if (onCard.isGiven(p) && carries(p)) {
                out.put(keyword(p), p.toCardValue(onCard.get(p)));
            }
        }
        return Collections.unmodifiableMap(out);
    }

    /**
     * The dialect called {@code name} (its short name or enum name, any case).
     *
     * @throws IllegalArgumentException listing the valid names
     */
    public static Dialect byName(String name) {
        String n = name == null ? "" : name.trim();
        for (Dialect d : values()) {
            if (d.shortName.equalsIgnoreCase(n) || d.name().equalsIgnoreCase(n)) {
                return d;
            }
        }
        throw new IllegalArgumentException("unknown dialect '" + name + "'; valid names: " + validNames());
    }

    /** The short names of all dialects, comma-separated, for help texts and error messages. */
    public static String validNames() {
        return Arrays.stream(values()).map(Dialect::shortName).collect(Collectors.joining(", "));
    }
}
