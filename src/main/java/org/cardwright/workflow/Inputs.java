package org.cardwright.workflow;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.cardwright.data.DataFileException;
import org.cardwright.data.CvPoint;
import org.cardwright.data.DataKind;
import org.cardwright.data.IvPoint;
import org.cardwright.data.MeasurementFile;
import org.cardwright.data.MeasurementReader;
import org.cardwright.data.ReadOptions;
import org.cardwright.data.RecoveryReader;

/**
 * The measurement files of one job, read and sorted by kind (with a note for anything set aside; nothing
 * disappears silently).
 *
 * @param files       every file read
 * @param forward     forward I-V points (positive current) with their origin
 * @param reverse     reverse I-V points (negative voltage and current) with their origin
 * @param capacitance C-V points with their origin
 * @param recovery    reverse-recovery record files
 * @param notes       what was set aside or changed, for the user
 */
public record Inputs(List<MeasurementFile> files, List<Located> forward, List<Located> reverse,
                     List<LocatedCapacitance> capacitance, List<RecoveryReader.Records> recovery, List<String> notes) {

    /**
     * A forward point and where it came from.
     *
     * @param point  the point [SI]
     * @param source the file name as the user gave it
     */
    public record Located(IvPoint point, String source) {
    }

    /**
     * A C-V point and where it came from.
     *
     * @param point  the point [SI]
     * @param source the file name as the user gave it
     */
    public record LocatedCapacitance(CvPoint point, String source) {
    }

    /** Reads every file; points that are neither forward nor reverse (zero current, mixed signs) are set aside. */
    public static Inputs read(List<Path> paths, ReadOptions options) throws DataFileException {
        MeasurementReader reader = new MeasurementReader(options);
        List<MeasurementFile> files = new ArrayList<>();
        List<Located> forward = new ArrayList<>();
        List<Located> reverse = new ArrayList<>();
        List<LocatedCapacitance> capacitance = new ArrayList<>();
        List<RecoveryReader.Records> recovery = new ArrayList<>();
        List<String> notes = new ArrayList<>();
        for (Path p : paths) {
            if (RecoveryReader.looksLikeRecovery(p)) {
                recovery.add(new RecoveryReader(options.defaultTemperature()).read(p));
                continue;
            }
            MeasurementFile f = reader.read(p);
            files.add(f);
            String name = displayName(p);
            f.notices().forEach(n -> notes.add(n.toString()));
            if (f.kind() == DataKind.CV) {
                f.cv().forEach(c -> capacitance.add(new LocatedCapacitance(c, name)));
                continue;
            }
            int aside = 0;
            int firstAside = 0;
            for (IvPoint pt : f.iv()) {
                if (pt.current() > 0) {
                    forward.add(new Located(pt, name));
                } else if (pt.current() < 0 && pt.voltage() < 0) {
                    reverse.add(new Located(pt, name));
                } else {
                    if (aside++ == 0) {
                        firstAside = pt.line();
                    }
                }
            }
            if (aside > 0) {
                notes.add(name + ":" + firstAside + ": " + aside
                        + " points with zero current, or with current and voltage of opposite signs, set aside");
            }
        }
        return new Inputs(List.copyOf(files), List.copyOf(forward), List.copyOf(reverse), List.copyOf(capacitance),
                List.copyOf(recovery), List.copyOf(notes));
    }

    /** The path as the user wrote it, with forward slashes, so that provenance is the same on every machine. */
    public static String displayName(Path p) {
        return p.toString().replace('\\', '/');
    }
}
