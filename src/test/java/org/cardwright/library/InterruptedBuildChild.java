package org.cardwright.library;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.atomic.AtomicInteger;
import org.cardwright.workflow.OutputFiles;

/**
 * Run in a child JVM by {@link InterruptedBuildTest}: builds a library, and at the Nth card write puts half of the
 * new text into the temporary file beside the card (as the real writer does before its rename), says
 * {@code MID-WRITE} on standard output and waits to be killed.
 */
public final class InterruptedBuildChild {
    private InterruptedBuildChild() {
    }

    public static void main(String[] args) throws Exception {
        Path root = Path.of(args[0]);
        int stopAt = Integer.parseInt(args[1]);
        AtomicInteger cardWrites = new AtomicInteger();
        LibraryBuilder builder = new LibraryBuilder(false, (target, text) -> {
            if (target.toString().endsWith(".lib") && cardWrites.incrementAndGet() == stopAt) {
                try {
                    Path tmp = Files.createTempFile(target.toAbsolutePath().getParent(), "." + target.getFileName(), ".tmp");
                    Files.writeString(tmp, text.substring(0, text.length() / 2), StandardCharsets.UTF_8);
                } catch (IOException e) {
                    throw new IllegalStateException(e);
                }
                System.out.println("MID-WRITE " + target);
                System.out.flush();
                try {
                    Thread.sleep(600_000);
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                }
            }
            OutputFiles.writeAtomically(target, text);
        });
        builder.build(root, line -> {
            System.out.println(line);
            System.out.flush();
        });
        System.out.println("DONE");
    }
}
