package org.cardwright.workflow;

import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import org.cardwright.card.Dialect;
import org.cardwright.compare.ComparisonLimits;

/**
 * Everything the compare job needs, as the user gave it; what is not given takes the defaults of
 * {@link CompareWorkflow}. Every bias is written as the user typed it (SPICE suffixes allowed) and is read, with its
 * option's name in any error, by {@link CompareWorkflow#plan}.
 *
 * @param cardA              the first card file
 * @param cardB              the second card file
 * @param modelA             the model name card A must carry, if stated
 * @param modelB             the model name card B must carry, if stated
 * @param dialectA           card A's dialect; empty to infer it from a NAME.DIALECT.lib file name (else ngspice)
 * @param dialectB           card B's dialect, likewise
 * @param engine             who simulates both cards
 * @param temperatures       device temperatures [degC]; empty for {@link CompareWorkflow#DEFAULT_TEMPERATURES}
 * @param from               lowest decade of forward current, as typed
 * @param to                 highest decade of forward current, as typed
 * @param leakageAt          reverse voltages for leakage, positive magnitudes as typed
 * @param capacitanceAt      reverse voltages for capacitance, magnitudes as typed
 * @param breakdownAt        the breakdown reference current, a positive magnitude as typed; empty for the cards' IBV
 * @param limits             when a difference is flagged
 * @param data               measurement files to overlay both cards on (for the page); may be empty
 * @param html               where to write the overlay page, if anywhere
 * @param force              replace an existing page
 */
public record CompareRequest(Path cardA, Path cardB, Optional<String> modelA, Optional<String> modelB,
                             Optional<Dialect> dialectA, Optional<Dialect> dialectB, EngineChoice engine,
                             List<Double> temperatures, String from, String to, List<String> leakageAt,
                             List<String> capacitanceAt, Optional<String> breakdownAt, ComparisonLimits limits,
                             List<Path> data, Optional<Path> html, boolean force) {
    public CompareRequest {
        temperatures = List.copyOf(temperatures);
        leakageAt = List.copyOf(leakageAt);
        capacitanceAt = List.copyOf(capacitanceAt);
        data = List.copyOf(data);
        if (html.isPresent() && data.isEmpty()) {
            throw new org.cardwright.failure.UsageException("--html needs the data to overlay the cards on: name them with --data");
        }
    }
}
