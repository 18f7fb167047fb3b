package org.cardwright.lot;

import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.cardwright.card.SpiceNumbers;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.Param;

/**
 * The lot's parameter sets: the typical one, corners and the Monte Carlo expressions.
 *
 * <p><b>Typical.</b> Each parameter of {@link LotStatistics#common} at its mean in its space (for log10
 * parameters the geometric mean); every other parameter the parts carry at its median over the parts that are not
 * outliers.
 *
 * <p><b>Forward-voltage corners.</b> With g the gradient of VF(IF) with respect to the parameters (in their spaces,
 * central differences on the typical card) and C the lot's covariance, the points mean +- k C g / sqrt(g^T C g) lie
 * on the k-sigma ellipsoid of the parameter distribution where VF is lowest and highest to first order: every
 * parameter moves with its correlated partners, and VF moves by +- k sigma_VF, sigma_VF^2 = g^T C g. This is the
 * linearised worst-case point of K. J. Antreich, H. E. Graeb and C. U. Wieser, "Circuit analysis and optimization
 * driven by worst-case distances", IEEE Trans. Computer-Aided Design 13(1) (1994) 57-71 (recalled). In the
 * principal components it is the combination xi_c proportional to sqrt(lambda_c) (w_c^T D g).
 *
 * <p><b>Principal corners.</b> mean +- k L_c for the leading principal components (columns of
 * {@link LotStatistics#loadings}) that carry at least {@value #PRINCIPAL_SHARE} of the standardised variance.
 */
public final class LotCards {

    /** A principal component gets its own corners when it carries at least this share of the variance [1]. */
    static final double PRINCIPAL_SHARE = 0.1;
    /** Relative step of the central difference, in each parameter's space (in units of its lot std) [1]. */
    static final double GRADIENT_STEP = 0.01;

    /**
     * One parameter set with a name and what it is.
     *
     * @param suffix     file-name part: typical, vf-low, vf-high, pc1-low, ...
     * @param modelName  the model name on the card
     * @param parameters the parameters [SI]
     * @param lines      provenance lines saying how it was made
     */
    public record Corner(String suffix, String modelName, DiodeParameters parameters, List<String> lines) {
    }

    private LotCards() {
    }

    /** The typical parameter set. */
    static DiodeParameters typical(LotStatistics s) {
        Map<Param, Double> values = new EnumMap<>(Param.class);
        List<PartResult> parts = s.inliers();
        for (Param p : Param.values()) {
            double[] x = parts.stream().filter(r -> r.values().containsKey(p))
                    .mapToDouble(r -> LotStatistics.toSpace(p, r.values().get(p))).toArray();
            if (x.length * 2 < parts.size() || x.length == 0) {
                continue;
            }
            values.put(p, LotStatistics.fromSpace(p, LotStatistics.median(x)));
        }
        for (int i = 0; i < s.common().size(); i++) {
            Param p = s.common().get(i);
            values.put(p, LotStatistics.fromSpace(p, s.mean()[i]));
        }
        return DiodeParameters.of(values);
    }

    /** {@code base} with the common parameters set to {@code theta} (in their spaces); values out of range clamped and said. */
    static DiodeParameters at(LotStatistics s, DiodeParameters base, double[] theta, List<String> notes) {
        DiodeParameters p = base;
        for (int i = 0; i < theta.length; i++) {
            Param q = s.common().get(i);
            double v = LotStatistics.fromSpace(q, theta[i]);
            double fixed = clamp(q, v);
            if (fixed != v) {
                notes.add(String.format(Locale.ROOT, "%s would be %.4g, outside its range; written as %.4g", q.name(), v, fixed));
            }
            p = p.with(q, fixed);
        }
        return p;
    }

    private static double clamp(Param p, double v) {
        return switch (p) {
            case RS, CJO, TT -> Math.max(0, v);
            case M, FC -> Math.min(Math.max(0, v), 0.99);
            case N, NR, NBV, VJ -> Math.max(1e-3, v);
            default -> v;
        };
    }

    /** The corners, the typical set first. {@code vf} gives VF(IF) of a parameter set; null when the lot has no VF. */
    static List<Corner> corners(String name, LotStatistics s, double sigma, java.util.function.ToDoubleFunction<DiodeParameters> vf) {
        List<Corner> out = new ArrayList<>();
        DiodeParameters typ = typical(s);
        out.add(new Corner("typical", name, typ, List.of(
                "typical: the lot's mean of " + names(s.common()) + " (log10 parameters: geometric mean); others at their median")));
        int k = s.common().size();
        if (k == 0) {
            return out;
        }
        double[][] cov = s.covariance();
        if (vf != null) {
            double[] g = new double[k];
            for (int i = 0; i < k; i++) {
                double h = GRADIENT_STEP * (s.std()[i] > 0 ? s.std()[i] : 1e-3);
                double[] up = s.mean().clone();
                double[] dn = s.mean().clone();
                up[i] += h;
                dn[i] -= h;
                g[i] = (vf.applyAsDouble(at(s, typ, up, new ArrayList<>())) - vf.applyAsDouble(at(s, typ, dn, new ArrayList<>()))) / (2 * h);
            }
            double[] cg = new double[k];
            double gcg = 0;
            for (int i = 0; i < k; i++) {
                for (int j = 0; j < k; j++) {
                    cg[i] += cov[i][j] * g[j];
                }
                gcg += g[i] * cg[i];
            }
            if (gcg > 0 && Double.isFinite(gcg)) {
                double sd = Math.sqrt(gcg);
                for (int sign : new int[] {-1, 1}) {
                    double[] theta = new double[k];
                    for (int i = 0; i < k; i++) {
                        theta[i] = s.mean()[i] + sign * sigma * cg[i] / sd;
                    }
                    List<String> lines = new ArrayList<>();
                    lines.add(String.format(Locale.ROOT,
                            "%s forward-voltage corner: %.3g sigma along C g/sqrt(g'Cg), the direction of the parameter distribution in which VF rises fastest;",
                            sign < 0 ? "low" : "high", sigma));
                    lines.add(String.format(Locale.ROOT, "  linearised sigma of VF over the lot %.4g mV; %s move together",
                            sd * 1e3, names(s.common())));
                    DiodeParameters p = at(s, typ, theta, lines);
                    out.add(new Corner(sign < 0 ? "vf-low" : "vf-high", name + (sign < 0 ? "_VFLO" : "_VFHI"), p, lines));
                }
            }
        }
        double[][] l = s.loadings();
        double total = 0;
        for (double v : s.components().values()) {
            total += Math.max(0, v);
        }
        for (int c = 0; c < l[0].length; c++) {
            double share = s.components().values()[c] / total;
            if (share < PRINCIPAL_SHARE) {
                break;
            }
            for (int sign : new int[] {-1, 1}) {
                double[] theta = new double[k];
                for (int i = 0; i < k; i++) {
                    theta[i] = s.mean()[i] + sign * sigma * l[i][c];
                }
                List<String> lines = new ArrayList<>();
                lines.add(String.format(Locale.ROOT, "principal component %d (%.1f %% of the standardised variance) at %s%.3g sigma",
                        c + 1, 100 * share, sign < 0 ? "-" : "+", sigma));
                DiodeParameters p = at(s, typ, theta, lines);
                String suffix = "pc" + (c + 1) + (sign < 0 ? "-low" : "-high");
                out.add(new Corner(suffix, name + "_PC" + (c + 1) + (sign < 0 ? "LO" : "HI"), p, lines));
            }
        }
        return out;
    }

    private static String names(List<Param> ps) {
        return String.join(" ", ps.stream().map(Param::name).toList());
    }

    /** The prefix of the Monte Carlo card's .param names for lot {@code name}: cwlot_ and the name in lower case. */
    public static String parameterPrefix(String name) {
        return "cwlot_" + name.replaceAll("[^A-Za-z0-9_]", "_").toLowerCase(Locale.ROOT);
    }

    /**
     * The ngspice Monte Carlo card: one standard normal per principal component (the {@code .param}s
     * PREFIX_z1 ... PREFIX_zK, 0 by default, i.e. the typical part), each statistical parameter the lot's mean plus
     * its loadings times those normals (in its space; log10 parameters through exp(ln 10 x)), every other parameter
     * as on the typical card.
     *
     * <p>A part is drawn by {@code alterparam PREFIX_zK = agauss(0,1,1)} (no blanks inside the parentheses: alterparam splits at them) for every K, then {@code reset}, in a
     * {@code .control} loop: measured in ngspice 39, alterparam draws once and every reference sees that value.
     * The same {@code agauss} written into the {@code .param} line itself would be drawn again at every reference
     * (ngspice 39 evaluates a random .param where it is used), so parameters sharing a component would be drawn
     * independently and the correlations lost: the card does not do that. ngspice 39 manual, chapters "Parametric
     * netlists" (.param, agauss) and "Statistical circuit analysis" (alterparam, reset); recalled and checked in
     * ngspice 39 by {@code LotAcceptanceTest}.
     */
    static String monteCarloCard(String name, LotStatistics s, List<String> provenance, int digits) {
        String prefix = parameterPrefix(name);
        double[][] l = s.loadings();
        int comps = l.length == 0 ? 0 : l[0].length;
        DiodeParameters typ = typical(s);
        StringBuilder sb = new StringBuilder();
        for (String line : provenance) {
            sb.append('*').append(line.isEmpty() ? "" : " " + line).append('\n');
        }
        sb.append("* Monte Carlo in ngspice: in a .control loop, draw every component, reset, then analyse:\n");
        for (int c = 0; c < comps; c++) {
            sb.append("*   alterparam ").append(prefix).append("_z").append(c + 1).append(" = agauss(0,1,1)\n");
        }
        sb.append("*   reset\n");
        sb.append("* Left at 0, the z are the typical part. Do not put agauss on the .param lines: ngspice draws a random\n");
        sb.append("* .param anew wherever it is used, which would lose the correlations.\n");
        for (int c = 0; c < comps; c++) {
            sb.append(".param ").append(prefix).append("_z").append(c + 1).append(" = 0\n");
        }
        for (int i = 0; i < s.common().size(); i++) {
            Param p = s.common().get(i);
            sb.append(".param ").append(prefix).append('_').append(p.name().toLowerCase(Locale.ROOT)).append(" = {")
                    .append(number(s.mean()[i]));
            for (int c = 0; c < comps; c++) {
                if (l[i][c] != 0) {
                    sb.append(l[i][c] < 0 ? " - " : " + ").append(number(Math.abs(l[i][c]))).append('*')
                            .append(prefix).append("_z").append(c + 1);
                }
            }
            sb.append("}\n");
        }
        sb.append(".model ").append(name).append(" D(\n");
        for (Param p : Param.values()) {
            int i = s.common().indexOf(p);
            if (i >= 0) {
                String v = prefix + "_" + p.name().toLowerCase(Locale.ROOT);
                sb.append("+ ").append(p.name()).append("={")
                        .append(p.fitScale() == Param.Scale.LOG ? "exp(2.302585092994046*" + v + ")" : v).append("}\n");
            } else if (typ.isGiven(p)) {
                sb.append("+ ").append(p.name()).append('=').append(SpiceNumbers.cardValue(p, p.toCardValue(typ.get(p)), digits)).append('\n');
            }
        }
        sb.append("+ )\n");
        return sb.toString();
    }

    /** A number for an ngspice expression: plain exponent form, 12 significant digits, no SPICE suffix. */
    static String number(double x) {
        return String.format(Locale.ROOT, "%.12g", x).replaceAll("(\\.\\d*?)0+(e|$)", "$1$2").replace(".e", "e").replaceAll("\\.$", "");
    }
}
