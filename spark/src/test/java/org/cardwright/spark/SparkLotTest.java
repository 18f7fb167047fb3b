package org.cardwright.spark;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Comparator;
import java.util.Map;
import java.util.TreeMap;
import java.util.stream.Stream;
import org.cardwright.cli.Main;
import org.cardwright.lot.LotOutcome;
import org.junit.jupiter.api.Test;

/**
 * The lot through Spark in local mode gives the same bytes as the plain parallel path: statistics, tables, JSON and
 * every card. The lot is the shipped invented one (fixtures/lot, 24 parts, made in ngspice 39 by
 * verify/tools/MakeLot.java).
 */
class SparkLotTest {

    @Test
    void sparkLocalModeWritesTheSameBytesAsThePlainPath() throws Exception {
        Path dir = SparkTestFiles.workDir("spark-lot");
        Path table = SparkTestFiles.projectDir().resolve("fixtures/lot/lt1-lot-forward.csv").toAbsolutePath().normalize();
        Path plain = dir.resolve("plain");
        Path spark = dir.resolve("spark");
        int code = Main.execute(new PrintWriter(new StringWriter()), new PrintWriter(new StringWriter()),
                "lot", table.toString(), "--name", "LT1", "--out", plain.toString(), "--jobs", "2", "--no-progress");
        assertEquals(0, code);
        LotOutcome o = SparkLot.run(SparkLot.Options.parse(table.toString(), "--name", "LT1", "--out", spark.toString(),
                "--master", "local[2]", "--partitions", "4"));
        assertEquals(24, o.parts().size());
        Map<String, byte[]> a = SparkTestFiles.outputs(plain);
        Map<String, byte[]> b = SparkTestFiles.outputs(spark);
        assertEquals(a.keySet(), b.keySet());
        assertTrue(a.containsKey("LT1.typical.ngspice.lib") && a.containsKey("LT1.montecarlo.ngspice.lib"), a.keySet().toString());
        for (String k : a.keySet()) {
            assertArrayEquals(a.get(k), b.get(k), k + " differs between the plain path and Spark");
        }
    }
}
