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
 * an error; NOT_CHECKABLE (the engine does not speak the card's dialect) is skipped.
 */
public final class CheckReport {
    private CheckReport() {
    }

    /**
     * The summary table: one row per card and data kind (the kind's worst temperature), then a closing count. A card
     * that was not run has one row with its result alone.
     */
    public static String table(List<CardCheck> checks) {
        StringBuilder sb = new StringBuilder();
        int width = Math.max(4, checks.stream().mapToInt(c -> c.card().length()).max().orElse(4));
        String row = "%-" + width + "s  %-13s  %-9s  %-7s  %8s  %9s  %9s  %-4s  %s%n";
        sb.append(String.format(Locale.ROOT, row, "card", "result", "kind", "verdict", "T [degC]", "RMS", "max", "unit",
                "fixed limits RMS/max; the residuals against the data's uncertainty"));
        for (CardCheck c : checks) {
            String result = c.status().name().toLowerCase(Locale.ROOT).replace('_', ' ');
            List<KindVerdicts.Kind> kinds = c.all().map(KindVerdicts::of).orElse(List.of());
            if (kinds.isEmpty()) {
                sb.append(String.format(Locale.ROOT, row, c.card(), result, "", "", "", "", "", "", ""));
            }
            for (int i = 0; i < kinds.size(); i++) {
                KindVerdicts.Kind k = kinds.get(i);
                String first = i == 0 ? c.card() : "";
                String limits = k.limits() + (k.noise().isEmpty() ? "" : "; " + k.noise());
                sb.append(String.format(Locale.ROOT, row, first, i == 0 ? result : "",
                        k.kind(), k.pass() ? "pass" : "FAIL", DeviceFile.celsiusText(k.temperature()),
                        KindVerdicts.number(k.rms()), KindVerdicts.number(k.max()), k.unit(), limits));
            }
        }
        long passed = checks.stream().filter(CardCheck::passed).count();
        long notCheckable = checks.stream().filter(CardCheck::notCheckable).count();
        sb.append(String.format(Locale.ROOT, "%d cards: %d passed, %d not%s%n", checks.size(), passed,
                checks.size() - passed - notCheckable,
                notCheckable == 0 ? "" : ", " + notCheckable + " not checkable with this engine"));
        return sb.toString();
    }

    /** The JUnit XML report; {@code suiteName} names the check, e.g. {@code cardwright check models}. */
    public static String junitXml(String suiteName, List<CardCheck> checks) {
        long failures = checks.stream().filter(c -> c.status() == CardCheck.Status.FAIL
                || c.status() == CardCheck.Status.OUTDATED || c.status() == CardCheck.Status.MISSING).count();
        long errors = checks.stream().filter(c -> c.status() == CardCheck.Status.ERROR).count();
        long skipped = checks.stream().filter(CardCheck::notCheckable).count();
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
            x.writeAttribute("skipped", Long.toString(skipped));
            x.writeAttribute("time", seconds(total));
            x.writeCharacters("\n");
            for (CardCheck c : checks) {
                x.writeCharacters("  ");
                x.writeStartElement("testcase");
                x.writeAttribute("classname", className(c.device()));
                x.writeAttribute("name", fileName(c.card()));
                x.writeAttribute("time", seconds(c.seconds()));
                if (c.notCheckable()) {
                    x.writeCharacters("\n    ");
                    x.writeStartElement("skipped");
                    x.writeAttribute("message", c.message());
                    x.writeEndElement();
                    x.writeCharacters("\n  ");
                } else if (c.status() != CardCheck.Status.PASS) {
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
        c.all().ifPresent(all -> KindVerdicts.of(all).forEach(k -> sb.append(k.text()).append('\n')));
        c.verification().ifPresent(v -> {
            for (TemperatureVerdict t : v.perTemperature()) {
                sb.append(String.format(Locale.ROOT, "forward at %s degC: %d points, RMS %s mV, max %s mV at %s, %s%n",
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
