package org.cardwright.workflow;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.cardwright.data.DataFileException;
import org.cardwright.data.DataKind;
import org.cardwright.data.IvPoint;
import org.cardwright.data.MeasurementFile;
import org.cardwright.data.MeasurementReader;
import org.cardwright.data.ReadOptions;

/**
 * The measurement files of one job, read and sorted into what this version can use and what it sets aside
 * (with a note for each set-aside group; nothing disappears silently).
 *
 * @param files   every file read
 * @param forward forward I-V points (positive current) with their origin
 * @param notes   what was set aside or changed, for the user
 */
public record Inputs(List<MeasurementFile> files, List<Located> forward, List<String> notes) {

    /**
     * A forward point and where it came from.
     *
     * @param point  the point [SI]
     * @param source the file name as the user gave it
     */
    public record Located(IvPoint point, String source) {
    }

    /** Reads every file; reverse and zero-current points and C-V files are set aside with a note. */
    public static Inputs read(List<Path> paths, ReadOptions options) throws DataFileException {
        MeasurementReader reader = new MeasurementReader(options);
        List<MeasurementFile> files = new ArrayList<>();
        List<Located> forward = new ArrayList<>();
        List<String> notes = new ArrayList<>();
        for (Path p : paths) {
            MeasurementFile f = reader.read(p);
            files.add(f);
            String name = displayName(p);
            f.notices().forEach(n -> notes.add(n.toString()));
            if (f.kind() == DataKind.CV) {
                notes.add(name + ": C-V data (" + f.cv().size() + " points) set aside: capacitance fitting is not available yet");
                continue;
            }
            int reverse = 0;
            int firstReverse = 0;
            for (IvPoint pt : f.iv()) {
                if (pt.current() > 0) {
                    forward.add(new Located(pt, name));
                } else {
                    if (reverse++ == 0) {
                        firstReverse = pt.line();
                    }
                }
            }
            if (reverse > 0) {
                notes.add(name + ":" + firstReverse + ": " + reverse
                        + " reverse or zero-current points set aside: the forward fit uses positive currents only, and reverse fitting is not available yet");
            }
        }
        return new Inputs(List.copyOf(files), List.copyOf(forward), List.copyOf(notes));
    }

    /** The path as the user wrote it, with forward slashes, so that provenance is the same on every machine. */
    public static String displayName(Path p) {
        return p.toString().replace('\\', '/');
    }
}
