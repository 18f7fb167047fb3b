package org.cardwright.library;

import java.io.StringWriter;
import java.util.List;
import java.util.Locale;
import javax.xml.stream.XMLOutputFactory;
import javax.xml.stream.XMLStreamException;
import javax.xml.stream.XMLStreamWriter;
import org.cardwright.verify.TemperatureVerdict;

/**
 * The reports of a library check: a summary table for people and a JUnit XML report for CI systems.
 *
 * <p>The XML follows the de-facto JUnit report format as the Maven Surefire plugin writes and reads it (one
 * {@code testsuite} element with {@code tests}, {@code failures}, {@code errors}, {@code skipped}, {@code time};
 * one {@code testcase} per card with {@code classname}, {@code name}, {@code time}; {@code failure} or
 * {@code error} children with {@code message} and {@code type}). One test case per card: the class name is the
 * device file's path with dots, the name is the card's file name. FAIL, OUTDATED and MISSING are failures; ERROR is
 * an error.
 */
public final class CheckReport {
    private CheckReport() {
    }

    /** The summary table, one row per card, and a closing count. */
    public static String table(List<CardCheck> checks) {
        StringBuilder sb = new StringBuilder();
        int width = Math.max(4, checks.stream().mapToInt(c -> c.card().length()).max().orElse(4));
        sb.append(String.format(Locale.ROOT, "%-" + width + "s  %-7s  %8s  %8s  %8s  %s%n", "card", "result", "T [degC]",
                "RMS [mV]", "max [mV]", "limits RMS/max [mV]"));
        for (CardCheck c : checks) {
            String t = "";
            String rms = "";
            String max = "";
            String limits = "";
            if (c.verification().isPresent()) {
                TemperatureVerdict w = worstVerdict(c);
                if (w != null) {
                    t = DeviceFile.celsiusText(w.temperature());
                    rms = PartFitter.mv(w.rms());
                    max = PartFitter.mv(w.max());
                }
                limits = PartFitter.mv(c.verification().get().tolerance().rms()) + "/"
                        + PartFitter.mv(c.verification().get().tolerance().max());
            }
            sb.append(String.format(Locale.ROOT, "%-" + width + "s  %-7s  %8s  %8s  %8s  %s%n", c.card(),
                    c.status().name().toLowerCase(Locale.ROOT), t, rms, max, limits));
        }
        long passed = checks.stream().filter(CardCheck::passed).count();
        sb.append(String.format(Locale.ROOT, "%d cards: %d passed, %d not%n", checks.size(), passed, checks.size() - passed));
        return sb.toString();
    }

    private static TemperatureVerdict worstVerdict(CardCheck c) {
        TemperatureVerdict w = null;
        for (TemperatureVerdict t : c.verification().get().perTemperature()) {
            if (w == null || (!t.pass() && w.pass()) || (t.pass() == w.pass() && t.rms() > w.rms())) {
                w = t;
            }
        }
        return w;
    }

    /** The JUnit XML report; {@code suiteName} names the check, e.g. {@code cardwright check models}. */
    public static String junitXml(String suiteName, List<CardCheck> checks) {
        long failures = checks.stream().filter(c -> c.status() == CardCheck.Status.FAIL
                || c.status() == CardCheck.Status.OUTDATED || c.status() == CardCheck.Status.MISSING).count();
        long errors = checks.stream().filter(c -> c.status() == CardCheck.Status.ERROR).count();
        double total = checks.stream().mapToDouble(CardCheck::seconds).sum();
        StringWriter out = new StringWriter();
        try {
            XMLStreamWriter x = XMLOutputFactory.newFactory().createXMLStreamWriter(out);
            x.writeStartDocument("UTF-8", "1.0");
            x.writeCharacters("\n");
            x.writeStartElement("testsuite");
            x.writeAttribute("name", suiteName);
            x.writeAttribute("tests", Integer.toString(checks.size()));
            x.writeAttribute("failures", Long.toString(failures));
            x.writeAttribute("errors", Long.toString(errors));
            x.writeAttribute("skipped", "0");
            x.writeAttribute("time", seconds(total));
            x.writeCharacters("\n");
            for (CardCheck c : checks) {
                x.writeCharacters("  ");
                x.writeStartElement("testcase");
                x.writeAttribute("classname", className(c.device()));
                x.writeAttribute("name", fileName(c.card()));
                x.writeAttribute("time", seconds(c.seconds()));
                if (c.status() != CardCheck.Status.PASS) {
                    x.writeCharacters("\n    ");
                    x.writeStartElement(c.status() == CardCheck.Status.ERROR ? "error" : "failure");
                    x.writeAttribute("message", c.message());
                    x.writeAttribute("type", "cardwright." + c.status().name().toLowerCase(Locale.ROOT));
                    x.writeCharacters(details(c));
                    x.writeEndElement();
                    x.writeCharacters("\n  ");
                }
                x.writeEndElement();
                x.writeCharacters("\n");
            }
            x.writeStartElement("system-out");
            x.writeCData(table(checks));
            x.writeEndElement();
            x.writeCharacters("\n");
            x.writeEndElement();
            x.writeCharacters("\n");
            x.writeEndDocument();
            x.close();
        } catch (XMLStreamException e) {
            throw new IllegalStateException("cannot write the JUnit XML report: " + e.getMessage(), e);
        }
        return out.toString();
    }

    private static String details(CardCheck c) {
        StringBuilder sb = new StringBuilder(c.card()).append(": ").append(c.message()).append('\n');
        c.verification().ifPresent(v -> {
            for (TemperatureVerdict t : v.perTemperature()) {
                sb.append(String.format(Locale.ROOT, "%s degC: %d points, RMS %s mV, max %s mV at %s, %s%n",
                        DeviceFile.celsiusText(t.temperature()), t.points(), PartFitter.mv(t.rms()), PartFitter.mv(t.max()),
                        t.worstSource(), t.pass() ? "pass" : "FAIL"));
            }
        });
        return sb.toString();
    }

    private static String className(String device) {
        String d = device.endsWith(DeviceFileReader.SUFFIX) ? device.substring(0, device.length() - DeviceFileReader.SUFFIX.length()) : device;
        return d.replace('/', '.');
    }

    private static String fileName(String card) {
        int slash = card.lastIndexOf('/');
        return slash < 0 ? card : card.substring(slash + 1);
    }

    private static String seconds(double s) {
        return String.format(Locale.ROOT, "%.3f", s);
    }
}
