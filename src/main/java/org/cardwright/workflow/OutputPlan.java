package org.cardwright.workflow;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.LinkOption;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;

/**
 * The files one command reads and the files it writes, checked against each other before anything is written:
 * the one place every command ({@code fit}, {@code verify}, {@code tweak}, {@code build}, {@code check}) asks
 * whether its outputs are safe to write.
 *
 * <p>Paths are compared where they really lead: symbolic links resolved (for a file that does not exist yet, its
 * nearest existing folder), and, for two files that exist, by {@link Files#isSameFile} (hard links). An output may
 * not be an input or a protected file of the same command, may not be named twice, and may not be a folder.
 * {@code --force} allows replacing an old output; it never allows any of this.
 */
public final class OutputPlan {
    /**
     * A file and what it is to the command, e.g. "data file" or "--json".
     *
     * @param real    where it leads ({@link #located})
     * @param fileKey the file system's identity of the file (device and inode on POSIX systems) when it exists and
     *                the system has one; null otherwise
     */
    private record Entry(String role, Path path, Path real, Object fileKey) {
    }

    private final List<Entry> reads = new ArrayList<>();
    private final List<Entry> writes = new ArrayList<>();
    /**
     * The first {@link #sharedReads} inputs indexed as {@link #check} looks them up, taken from the plan this one
     * was copied from: a library's plan of thousands of inputs is indexed once, not once per part.
     */
    private Map<Object, Entry> sharedIndex = Map.of();
    private int sharedReads;
    /** This plan's own index of all its inputs, kept for its copies while its inputs do not change. */
    private Map<Object, Entry> indexOfAll;
    private int indexedReads = -1;

    /** A new plan with this one's inputs and outputs (each located once), to add more to. */
    public synchronized OutputPlan copy() {
        OutputPlan c = new OutputPlan();
        c.reads.addAll(reads);
        c.writes.addAll(writes);
        c.sharedIndex = indexOfAll();
        c.sharedReads = reads.size();
        return c;
    }

    /** Every input by where it leads and by its file key, the first input of each (built once per set of inputs). */
    private Map<Object, Entry> indexOfAll() {
        if (indexOfAll == null || indexedReads != reads.size()) {
            Map<Object, Entry> all = new HashMap<>(sharedIndex);
            index(reads.subList(sharedReads, reads.size()), all);
            indexOfAll = all;
            indexedReads = reads.size();
        }
        return indexOfAll;
    }

    /** Adds each entry of {@code entries} under where it leads and its file key, unless an earlier one holds the key. */
    private static void index(List<Entry> entries, Map<Object, Entry> into) {
        for (Entry r : entries) {
            into.putIfAbsent(r.real(), r);
            if (r.fileKey() != null) {
                into.putIfAbsent(r.fileKey(), r);
            }
        }
    }

    /** The first input indexed under {@code key}: the shared ones come before this plan's own. */
    private Entry readAt(Object key, Map<Object, Entry> own) {
        Entry e = sharedIndex.get(key);
        return e != null ? e : own.get(key);
    }

    /** A file the command reads; no output may lead to it. */
    public OutputPlan input(String role, Path path) {
        reads.add(entry(role, path));
        return this;
    }

    /** Every file in {@code paths} as an input. */
    public OutputPlan inputs(String role, List<Path> paths) {
        paths.forEach(p -> input(role, p));
        return this;
    }

    /** A file the command must leave alone though it does not read it (a library's own cards for tweak). */
    public OutputPlan protect(String role, Path path) {
        return input(role, path);
    }

    /** A file the command will write. */
    public OutputPlan output(String role, Path path) {
        writes.add(entry(role, path));
        return this;
    }

    /**
     * Fails, naming both files and their roles, when an output leads to an input, to a protected file or to a folder
     * ({@link OutputException}), or to another output of the same command (a UsageException: the command
     * line names one file for two things, a usage error).
     */
    public void check() throws OutputException {
        // indexed by where each input leads and by its file key: a library's plan holds thousands of inputs, of
        // which those copied from the library's shared plan were indexed once for every part
        Map<Object, Entry> byPlace = new HashMap<>();
        index(reads.subList(sharedReads, reads.size()), byPlace);
        for (int i = 0; i < writes.size(); i++) {
            Entry w = writes.get(i);
            if (Files.isDirectory(w.real())) {
                throw new OutputException(shown(w.path()) + ": " + w.role() + " names a folder, not a file; write it somewhere else");
            }
            Entry hit = readAt(w.real(), byPlace);
            if (hit == null && w.fileKey() != null) {
                hit = readAt(w.fileKey(), byPlace);
            }
            if (hit != null) {
                throw new OutputException(shown(w.path()) + ": " + w.role() + " would overwrite " + hit.role() + " "
                        + shown(hit.path()) + via(w, hit) + "; an output may never replace an input of the same command, "
                        + "even with --force; write it somewhere else");
            }
            for (int j = 0; j < i; j++) {
                Entry o = writes.get(j);
                if (same(w, o)) {
                    throw new org.cardwright.failure.UsageException(shown(w.path()) + ": " + o.role() + " and " + w.role() + " name the same file"
                            + via(w, o) + "; give them different names");
                }
            }
        }
    }

    private static String via(Entry a, Entry b) {
        boolean plain = a.path().toAbsolutePath().normalize().equals(b.path().toAbsolutePath().normalize());
        return plain ? "" : " (both lead to " + shown(a.real()) + ")";
    }

    private static boolean same(Entry a, Entry b) {
        return a.real().equals(b.real()) || (a.fileKey() != null && a.fileKey().equals(b.fileKey()));
    }

    private static Entry entry(String role, Path path) {
        Objects.requireNonNull(role, "role");
        Objects.requireNonNull(path, "path");
        Path real = located(path);
        Object key = null;
        try {
            // hard links: two names of one file share the key
            key = Files.readAttributes(real, java.nio.file.attribute.BasicFileAttributes.class).fileKey();
        } catch (IOException e) {
            // does not exist (yet): only its located path can match
        }
        return new Entry(role, path, real, key);
    }

    /**
     * Where {@code path} really leads: its real path when it exists; otherwise the real path of its nearest existing
     * folder with the rest appended (what does not exist cannot be a link). A dangling link stays as it is: writing
     * replaces the link, not what it names.
     */
    public static Path located(Path path) {
        Path abs = path.toAbsolutePath();
        try {
            if (Files.exists(abs)) {
                return abs.toRealPath();
            }
            if (Files.exists(abs, LinkOption.NOFOLLOW_LINKS)) {
                Path parent = abs.getParent();
                return parent == null ? abs.normalize() : located(parent).resolve(abs.getFileName());
            }
            Path existing = abs.getParent();
            while (existing != null && !Files.exists(existing)) {
                existing = existing.getParent();
            }
            if (existing == null) {
                return abs.normalize();
            }
            return existing.toRealPath().resolve(existing.relativize(abs)).normalize();
        } catch (IOException e) {
            return abs.normalize();
        }
    }

    private static String shown(Path p) {
        return p.toString().replace('\\', '/');
    }
}
