package org.cardwright.spark;

import java.io.IOException;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.apache.parquet.column.page.PageReadStore;
import org.apache.parquet.example.data.Group;
import org.apache.parquet.example.data.simple.convert.GroupRecordConverter;
import org.apache.parquet.hadoop.ParquetFileReader;
import org.apache.parquet.io.ColumnIOFactory;
import org.apache.parquet.io.LocalInputFile;
import org.apache.parquet.io.MessageColumnIO;
import org.apache.parquet.io.RecordReader;
import org.apache.parquet.schema.MessageType;
import org.apache.parquet.schema.PrimitiveType;
import org.apache.parquet.schema.Type;

/**
 * A lot's long table in Apache Parquet, with the columns of the long CSV table: {@code part} (text), {@code V} [V],
 * {@code I} [A] or {@code C} [F], {@code T} [degC] (numbers as DOUBLE, FLOAT, INT32 or INT64; a column name may
 * carry its unit in brackets, "V [V]"; names are matched without regard to case). It is turned into the long CSV
 * table the lot already reads, every number in Java's shortest round-trip form, so a lot read from Parquet fits
 * exactly what the same table as CSV would give. The CSV is written into the lot's state folder.
 *
 * <p>Here, in the Spark module, and not in the core tool: Parquet's Java library needs Hadoop's client classes
 * (tens of megabytes, which Spark brings anyway); in the core jar they would slow every command's start-up for a
 * format only large lots need.
 */
public final class ParquetTable {
    private ParquetTable() {
    }

    /** True for a file named *.parquet. */
    public static boolean isParquet(Path p) {
        return p.getFileName().toString().toLowerCase(Locale.ROOT).endsWith(".parquet");
    }

    /** Writes {@code parquet} as a long CSV table into {@code dir} and returns the CSV's path. */
    public static Path toCsv(Path parquet, Path dir) throws IOException {
        Files.createDirectories(dir);
        String stem = parquet.getFileName().toString();
        stem = stem.substring(0, stem.length() - ".parquet".length());
        Path csv = dir.resolve(stem + ".csv");
        Path tmp = dir.resolve(stem + ".csv.tmp");
        try {
            write(parquet, tmp);
        } catch (IOException | RuntimeException e) {
            Files.deleteIfExists(tmp);
            throw e;
        }
        Files.move(tmp, csv, java.nio.file.StandardCopyOption.REPLACE_EXISTING, java.nio.file.StandardCopyOption.ATOMIC_MOVE);
        return csv;
    }

    private static void write(Path parquet, Path tmp) throws IOException {
        try (ParquetFileReader reader = ParquetFileReader.open(new LocalInputFile(parquet));
             Writer w = Files.newBufferedWriter(tmp, StandardCharsets.UTF_8)) {
            MessageType schema = reader.getFooter().getFileMetaData().getSchema();
            int part = column(schema, "part", parquet);
            int v = column(schema, "V", parquet);
            int i = optionalColumn(schema, "I");
            int c = optionalColumn(schema, "C");
            int t = column(schema, "T", parquet);
            if ((i < 0) == (c < 0)) {
                throw new IOException(parquet + ": needs exactly one of the columns I (current, A) and C (capacitance, F)");
            }
            w.write("# long table converted from " + parquet.getFileName() + " (Apache Parquet) by cardwright-spark\n");
            w.write(i >= 0 ? "part,V [V],I [A],T [degC]\n" : "part,V [V],C [F],T [degC]\n");
            int y = i >= 0 ? i : c;
            long row = 0;
            PageReadStore pages;
            while ((pages = reader.readNextRowGroup()) != null) {
                MessageColumnIO io = new ColumnIOFactory().getColumnIO(schema);
                RecordReader<Group> records = io.getRecordReader(pages, new GroupRecordConverter(schema));
                for (long k = 0; k < pages.getRowCount(); k++) {
                    Group g = records.read();
                    row++;
                    String name = g.getFieldRepetitionCount(part) == 0 ? "" : g.getValueToString(part, 0);
                    if (name.isEmpty() || name.indexOf(',') >= 0 || name.indexOf('"') >= 0 || name.chars().anyMatch(ch -> ch < 0x20)) {
                        throw new IOException(parquet + ", row " + row + ": part name '" + excerpt(name)
                                + "' is empty or holds a comma, a quote or a control character");
                    }
                    w.write(name + "," + number(g, v, schema, parquet, row) + "," + number(g, y, schema, parquet, row) + ","
                            + number(g, t, schema, parquet, row) + "\n");
                }
            }
        }
    }

    private static String number(Group g, int field, MessageType schema, Path file, long row) throws IOException {
        if (g.getFieldRepetitionCount(field) == 0) {
            throw new IOException(file + ", row " + row + ": no value in column " + schema.getFieldName(field));
        }
        Type type = schema.getType(field);
        double x = switch (type.asPrimitiveType().getPrimitiveTypeName()) {
            case DOUBLE -> g.getDouble(field, 0);
            case FLOAT -> g.getFloat(field, 0);
            case INT32 -> g.getInteger(field, 0);
            case INT64 -> g.getLong(field, 0);
            default -> throw new IOException(file + ": column " + schema.getFieldName(field) + " is "
                    + type.asPrimitiveType().getPrimitiveTypeName() + ", not a number");
        };
        if (!Double.isFinite(x)) {
            throw new IOException(file + ", row " + row + ": " + schema.getFieldName(field) + " is " + x);
        }
        return Double.toString(x);
    }

    private static int column(MessageType schema, String name, Path file) throws IOException {
        int k = optionalColumn(schema, name);
        if (k < 0) {
            List<String> have = new ArrayList<>();
            schema.getFields().forEach(f -> have.add(f.getName()));
            throw new IOException(file + ": no column '" + name + "' (columns: " + excerpt(String.join(", ", have)) + ")");
        }
        return k;
    }

    private static int optionalColumn(MessageType schema, String name) {
        for (int k = 0; k < schema.getFieldCount(); k++) {
            Type f = schema.getType(k);
            String n = f.getName().trim();
            int bracket = n.indexOf('[');
            String bare = (bracket >= 0 ? n.substring(0, bracket) : n).trim();
            if (bare.equalsIgnoreCase(name) && f.isPrimitive()) {
                PrimitiveType p = f.asPrimitiveType();
                if (!name.equals("part") || p.getPrimitiveTypeName() == PrimitiveType.PrimitiveTypeName.BINARY) {
                    return k;
                }
            }
        }
        return -1;
    }

    private static String excerpt(String s) {
        return s.length() > 60 ? s.substring(0, 60) + "..." : s;
    }
}
