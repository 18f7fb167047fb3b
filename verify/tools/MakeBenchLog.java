/*
 * Makes the invented series-resistor bench log in fixtures/bench/: simulates an invented diode card in
 * ngspice 39 on a simulated bench (a supply with a small source resistance, a series resistor stepped through
 * the decades 10 ohm .. 10 Mohm, a 10 Mohm meter across the diode), rounds the meter reading to 1 uV as a
 * 6.5-digit meter shows it, and writes the log, the true diode points, the card and the netlist.
 *
 * Run from the repository root (JDK 17+ and ngspice 39 needed, nothing else):
 *
 *     java verify/tools/MakeBenchLog.java [--out DIR] [--ngspice PATH] [--any-version]
 *
 * The output is byte-stable: the same ngspice version gives the same files every time (no randomness,
 * BigDecimal rounding, Locale.ROOT, "\n" line ends). The files are invented, not a measurement, and say so.
 */

import java.io.IOException;
import java.io.UncheckedIOException;
import java.math.BigDecimal;
import java.math.RoundingMode;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;

public final class MakeBenchLog {
    static final String TOOL = "verify/tools/MakeBenchLog.java";
    static final String REGENERATE = "java " + TOOL + " (from the repository root; needs ngspice 39)";
    static final String EXPECTED_VERSION = "ngspice-39";

    /** SPICE model name of the invented diode. */
    static final String MODEL_NAME = "BENCHD";
    /** The generating card (invented): a small silicon diode, ideality near 1, a little series resistance. */
    static final String PARAMETERS = "IS=2e-14 N=1.05 RS=0.4";
    static final String CARD = ".model " + MODEL_NAME + " D(" + PARAMETERS + ")";

    /** Series resistors, as the log writes them (SPICE suffixes), one per decade 10 ohm .. 10 Mohm. */
    static final String[] RESISTORS = {"10", "100", "1k", "10k", "100k", "1meg", "10meg"};
    /** Supply voltages set at each resistor [V]. */
    static final String[] SUPPLIES = {"1", "2", "5", "10"};
    /** Meter input resistance across the diode, as the log's setting writes it and as the netlist has it. */
    static final String METER = "10 Mohm";
    static final String METER_SPICE = "10meg";
    /** Output resistance of the supply [ohm]. */
    static final String SOURCE = "0.05";
    /** Device temperature [degC]. */
    static final String CELSIUS = "25";
    /** The meter shows 6 decimals of a volt: 1 uV per count [1]. */
    static final int METER_DECIMALS = 6;
    /**
     * Largest relative imbalance of the currents at the diode node we accept from the solver: reltol=1e-9 leaves
     * a few parts in 1e9, far below the 0.1 % the log is tested to [1].
     */
    static final double BALANCE_TOLERANCE = 1e-7;
    /** How long ngspice may run [s]. */
    static final long TIMEOUT_SECONDS = 120;

    static final String LOG = "simulated-meter-loading.csv";
    static final String TRUTH = "simulated-meter-loading-truth.csv";

    public static void main(String[] args) throws Exception {
        Path out = Path.of("fixtures", "bench");
        String ngspice = System.getenv().getOrDefault("CARDWRIGHT_NGSPICE", "ngspice");
        boolean anyVersion = false;
        for (int i = 0; i < args.length; i++) {
            switch (args[i]) {
                case "--out" -> out = Path.of(value(args, ++i, "--out"));
                case "--ngspice" -> ngspice = value(args, ++i, "--ngspice");
                case "--any-version" -> anyVersion = true;
                default -> fail("unknown argument '" + args[i] + "'; usage: java " + TOOL
                        + " [--out DIR] [--ngspice PATH] [--any-version]");
            }
        }
        String version = version(ngspice);
        if (!anyVersion && !version.equals(EXPECTED_VERSION)) {
            fail("found " + version + ", expected " + EXPECTED_VERSION + " (pass --any-version to accept it)");
        }
        Files.createDirectories(out);
        String netlist = netlist();
        Path work = Files.createTempDirectory("cardwright-bench");
        try {
            Files.writeString(work.resolve("circuit.cir"), netlist, StandardCharsets.UTF_8);
            run(List.of(ngspice, "-b", "circuit.cir"), work);
            List<double[]> rows = readDat(work.resolve("bench.dat"));
            if (rows.size() != RESISTORS.length * SUPPLIES.length) {
                fail("expected " + RESISTORS.length * SUPPLIES.length + " operating points, got " + rows.size());
            }
            write(out.resolve("generating-netlist.cir"), netlist);
            write(out.resolve("generating-card.lib"), cardFile(version));
            write(out.resolve(LOG), log(rows, version));
            write(out.resolve(TRUTH), truth(rows, version));
        } finally {
            try (Stream<Path> s = Files.walk(work)) {
                for (Path p : s.sorted(Comparator.reverseOrder()).toList()) {
                    Files.delete(p);
                }
            }
        }
        System.out.println("wrote " + out.resolve(LOG) + " and its truth, card and netlist (" + version + ")");
    }

    /** The deck: one operating point per (resistor, supply), in log order, each appended to bench.dat. */
    static String netlist() {
        StringBuilder s = new StringBuilder();
        s.append("* Invented series-resistor bench, simulated for cardwright (made by ").append(TOOL).append(")\n");
        s.append("* Invented data, not a measurement. Supply V1 with source resistance Rsrc, series resistor R1,\n");
        s.append("* diode D1, and the meter's input resistance Rm across the diode.\n");
        s.append("* bench.dat columns: (scale), v(s), v(d), @d1[id], @r1[i], @rm[i]\n");
        s.append("V1 s 0 dc 1\n");
        s.append("Rsrc s n ").append(SOURCE).append('\n');
        s.append("R1 n d 10\n");
        s.append("D1 d 0 ").append(MODEL_NAME).append('\n');
        s.append("Rm d 0 ").append(METER_SPICE).append('\n');
        s.append(CARD).append('\n');
        s.append(".options reltol=1e-9 vntol=1e-12 abstol=1e-18 temp=").append(CELSIUS).append('\n');
        s.append(".control\n");
        s.append("set wr_singlescale\n");
        s.append("option numdgt=15\n");
        boolean first = true;
        for (String r : RESISTORS) {
            s.append("alter R1 resistance = ").append(r).append('\n');
            for (String v : SUPPLIES) {
                s.append("alter V1 dc = ").append(v).append('\n');
                s.append("op\n");
                s.append("wrdata bench.dat v(s) v(d) @d1[id] @r1[i] @rm[i]\n");
                if (first) {
                    s.append("set appendwrite\n");
                    first = false;
                }
            }
        }
        s.append("quit\n.endc\n.end\n");
        return s.toString();
    }

    static String cardFile(String version) {
        return "* BENCHD: an invented small silicon diode (not a real part).\n"
                + "* This card generated the invented series-resistor bench log in fixtures/bench/ (simulated in "
                + version + ";\n* see README.md there). Made by " + TOOL + "; regenerate with: " + REGENERATE + "\n"
                + CARD + "\n";
    }

    static String header(String version) {
        return "# Invented bench data, not a measurement: simulated in " + version + " with the invented card\n"
                + "#   " + CARD + "\n"
                + "#   (generating-card.lib; deck generating-netlist.cir beside this file, exactly as it was run).\n"
                + "# Scenario: an invented bench, a supply with 0.05 ohm source resistance drives the diode through\n"
                + "#   a series resistor stepped 10 ohm .. 10 Mohm, a meter with 10 Mohm input resistance reads the\n"
                + "#   diode voltage; the device is at 25 degC. The simulated supply, resistors and meter are exact;\n"
                + "#   the meter reading is rounded to 1 uV as a 6.5-digit meter shows it.\n"
                + "# Made by " + TOOL + "; regenerate with: " + REGENERATE + "\n";
    }

    static String log(List<double[]> rows, String version) {
        StringBuilder s = new StringBuilder(header(version));
        s.append("# The tolerances below are what such a bench would state; the fit uses them as weights.\n");
        s.append("# temperature = ").append(CELSIUS).append(" degC\n");
        s.append("# meter input resistance = ").append(METER).append('\n');
        s.append("# meter input resistance tolerance = 1 %\n");
        s.append("# supply source resistance = ").append(SOURCE).append(" ohm\n");
        s.append("# resistor tolerance = 0.1 %\n");
        s.append("# supply accuracy = 0.02 % + 1 mV\n");
        s.append("# voltmeter accuracy = 0.0035 % + 5 counts\n");
        s.append("# voltmeter resolution = 1 uV\n");
        s.append("Vsupply [V],Rseries,Vmeter [V]\n");
        int k = 0;
        for (String r : RESISTORS) {
            for (String v : SUPPLIES) {
                double[] row = rows.get(k++);
                check(Math.abs(row[0] - Double.parseDouble(v)) < 1e-12, "supply node at " + v + " V");
                BigDecimal meter = new BigDecimal(row[1]).setScale(METER_DECIMALS, RoundingMode.HALF_EVEN);
                s.append(v).append(',').append(r).append(',').append(meter.toPlainString()).append('\n');
            }
        }
        return s.toString();
    }

    static String truth(List<double[]> rows, String version) {
        StringBuilder s = new StringBuilder(header(version));
        s.append("# The true diode points of " + LOG + ", row for row: V = v(d) and I = @d1[id] as ngspice\n");
        s.append("#   computed them (15 digits), before any rounding; for checking the log's correction and fits.\n");
        s.append("V [V],I [A],T [degC]\n");
        for (double[] row : rows) {
            s.append(String.format(java.util.Locale.ROOT, "%.15e,%.15e,%s%n", row[1], row[2], CELSIUS)
                    .replace(System.lineSeparator(), "\n"));
        }
        return s.toString();
    }

    static List<double[]> readDat(Path file) throws IOException {
        List<double[]> rows = new ArrayList<>();
        for (String line : Files.readAllLines(file, StandardCharsets.UTF_8)) {
            String t = line.strip();
            if (t.isEmpty()) {
                continue;
            }
            String[] cells = t.split("\\s+");
            check(cells.length == 6, "bench.dat row with 6 columns: " + line);
            // columns: scale, v(s), v(d), @d1[id], @r1[i], @rm[i]; kept without the scale
            double[] row = new double[5];
            for (int i = 0; i < 5; i++) {
                row[i] = Double.parseDouble(cells[i + 1]);
            }
            // Kirchhoff at the diode node, as the simulator solved it: i(R1) = id + i(Rm)
            check(Math.abs(row[3] - row[2] - row[4]) <= BALANCE_TOLERANCE * Math.abs(row[3]),
                    "node current balance in " + line);
            rows.add(row);
        }
        return rows;
    }

    static String version(String ngspice) throws IOException, InterruptedException {
        Process p = new ProcessBuilder(ngspice, "-v").redirectErrorStream(true).start();
        String text = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        p.waitFor(30, TimeUnit.SECONDS);
        for (String line : text.split("\\R")) {
            String stripped = line.replaceAll("^[\\s*]+|[\\s*]+$", "");
            if (stripped.startsWith("ngspice")) {
                int colon = stripped.indexOf(" : ");
                return colon > 0 ? stripped.substring(0, colon).trim() : stripped;
            }
        }
        fail("'" + ngspice + " -v' printed no version banner");
        return null;
    }

    static void run(List<String> command, Path dir) throws IOException, InterruptedException {
        Process p = new ProcessBuilder(command).directory(dir.toFile()).redirectErrorStream(true)
                .redirectOutput(dir.resolve("ngspice.log").toFile()).start();
        if (!p.waitFor(TIMEOUT_SECONDS, TimeUnit.SECONDS)) {
            p.destroyForcibly();
            fail("ngspice ran longer than " + TIMEOUT_SECONDS + " s");
        }
        String log = Files.readString(dir.resolve("ngspice.log"), StandardCharsets.UTF_8);
        if (p.exitValue() != 0 || log.toLowerCase(java.util.Locale.ROOT).contains("error")) {
            fail("ngspice failed (exit " + p.exitValue() + "):\n" + log);
        }
    }

    static void write(Path file, String text) {
        try {
            Files.writeString(file, text, StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    static String value(String[] args, int i, String option) {
        if (i >= args.length) {
            fail(option + " needs a value");
        }
        return args[i];
    }

    static void check(boolean ok, String what) {
        if (!ok) {
            fail("check failed: " + what);
        }
    }

    static void fail(String message) {
        System.err.println("MakeBenchLog: " + message);
        System.exit(1);
    }
}
