package org.cardwright.spark;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Comparator;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.stream.Stream;
import org.apache.parquet.example.data.Group;
import org.apache.parquet.example.data.simple.SimpleGroupFactory;
import org.apache.parquet.hadoop.ParquetWriter;
import org.apache.parquet.hadoop.example.ExampleParquetWriter;
import org.apache.parquet.io.LocalOutputFile;
import org.apache.parquet.schema.MessageType;
import org.apache.parquet.schema.MessageTypeParser;
import org.cardwright.cli.Main;
import org.junit.jupiter.api.Test;

/**
 * A lot given as an Apache Parquet long table (part, V, I, T) gives, through Spark local mode, the same statistics,
 * tables and cards as the same rows given as CSV through the plain path. The table is the shipped invented lot
 * (fixtures/lot, 24 parts made in ngspice 39), its rows written to Parquet by Parquet's own example writer.
 */
class ParquetLotTest {

    /** The CSV long table's rows as Parquet: part as UTF-8 text, V, I, T as doubles. */
    private static void writeParquet(Path csv, Path parquet, String schemaText) throws IOException {
        MessageType schema = MessageTypeParser.parseMessageType(schemaText);
        SimpleGroupFactory groups = new SimpleGroupFactory(schema);
        try (ParquetWriter<Group> w = ExampleParquetWriter.builder(new LocalOutputFile(parquet)).withType(schema).build()) {
            for (String line : Files.readAllLines(csv, StandardCharsets.UTF_8)) {
                if (line.startsWith("#") || line.startsWith("part")) {
                    continue;
                }
                String[] f = line.split(",");
                w.write(groups.newGroup().append(schema.getFieldName(0), f[0]).append(schema.getFieldName(1), Double.parseDouble(f[1]))
                        .append(schema.getFieldName(2), Double.parseDouble(f[2])).append(schema.getFieldName(3), Double.parseDouble(f[3])));
            }
        }
    }

    @Test
    void aParquetLotThroughSparkGivesTheSameBytesAsItsCsvThroughThePlainPath() throws Exception {
        Path dir = SparkTestFiles.workDir("parquet-lot");
        Path table = SparkTestFiles.projectDir().resolve("fixtures/lot/lt1-lot-forward.csv").toAbsolutePath().normalize();
        Path parquet = dir.resolve("lt1-lot-forward.parquet");
        writeParquet(table, parquet, "message lot { required binary part (UTF8); required double V; required double I; required double T; }");
        Path plain = dir.resolve("plain");
        Path spark = dir.resolve("spark");
        assertEquals(0, Main.execute(new PrintWriter(new StringWriter()), new PrintWriter(new StringWriter()),
                "lot", table.toString(), "--name", "LT1", "--out", plain.toString(), "--jobs", "2", "--no-progress"));
        var o = SparkLot.run(SparkLot.Options.parse(parquet.toString(), "--name", "LT1", "--out", spark.toString(), "--master", "local[2]"));
        assertEquals(24, o.parts().size());
        Map<String, byte[]> a = SparkTestFiles.outputs(plain);
        Map<String, byte[]> b = SparkTestFiles.outputs(spark);
        assertEquals(a.keySet(), b.keySet());
        assertTrue(a.containsKey("LT1.statistics.csv") && a.containsKey("LT1.typical.ngspice.lib"), a.keySet().toString());
        for (String k : a.keySet()) {
            assertArrayEquals(a.get(k), b.get(k), k + " differs between CSV (plain path) and Parquet (Spark)");
        }
    }

    @Test
    void aParquetTableWithoutACurrentOrCapacitanceColumnIsRefusedNamingTheFile() throws Exception {
        Path dir = SparkTestFiles.workDir("parquet-bad");
        Path table = SparkTestFiles.projectDir().resolve("fixtures/lot/lt1-lot-forward.csv").toAbsolutePath().normalize();
        Path parquet = dir.resolve("bad.parquet");
        writeParquet(table, parquet, "message lot { required binary part (UTF8); required double V; required double X; required double T; }");
        IOException e = assertThrows(IOException.class, () -> ParquetTable.toCsv(parquet, dir.resolve("out")));
        assertTrue(e.getMessage().contains("bad.parquet") && e.getMessage().contains("I (current, A)"), e.getMessage());
        assertEquals(List.of(), List.of(dir.resolve("out").toFile().list()), "nothing left behind");
    }
}
