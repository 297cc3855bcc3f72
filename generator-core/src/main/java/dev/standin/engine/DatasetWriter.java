package dev.standin.engine;

import dev.standin.marginal.Marginal;
import dev.standin.marginal.ValueKind;
import dev.standin.output.AtomicFile;
import dev.standin.output.CellKind;
import dev.standin.output.CsvRowWriter;
import dev.standin.output.JsonRowWriter;
import dev.standin.output.NumberText;
import dev.standin.output.RowWriter;
import dev.standin.report.Check;
import dev.standin.report.DatasetStats;
import dev.standin.report.FidelityChecks;
import dev.standin.report.HtmlReport;
import dev.standin.sampling.RowSampler;
import dev.standin.spec.ColumnSpec;
import dev.standin.spec.OutputSpec;
import dev.standin.spec.Spec;
import java.io.BufferedWriter;
import java.io.IOException;
import java.io.OutputStream;
import java.io.OutputStreamWriter;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.DigestOutputStream;
import java.time.Instant;
import java.time.LocalDate;
import java.security.MessageDigest;
import java.util.ArrayList;
import java.util.List;

/**
 * Streams a compiled spec's rows into its data file while measuring what was written, then writes
 * the report. Memory is bounded by the number of columns, not rows.
 */
final class DatasetWriter {

    private DatasetWriter() {
    }

    /** How many rows pass between two calls of the progress callback. */
    static final long PROGRESS_EVERY = 1L << 16;

    static GenerationResult write(CompiledSpec compiled, Path outputRoot, java.util.function.LongConsumer progress)
            throws IOException {
        Spec spec = compiled.spec();
        List<ColumnSpec> columns = spec.columns();
        int k = columns.size();
        RowSampler sampler = new RowSampler(spec, compiled.model());
        RowSampler.Scratch scratch = sampler.scratch();
        int[] decimals = new int[k];
        CellKind[] kinds = new CellKind[k];
        ValueKind[] valueKinds = new ValueKind[k];
        Marginal[] marginals = new Marginal[k];
        List<String> names = new ArrayList<>();
        for (int i = 0; i < k; i++) {
            ColumnSpec c = columns.get(i);
            names.add(c.name());
            decimals[i] = c instanceof ColumnSpec.Random r ? r.decimals() : 0;
            valueKinds[i] = c instanceof ColumnSpec.Random r ? r.marginal().valueKind() : ValueKind.INTEGER;
            marginals[i] = c instanceof ColumnSpec.Random r ? r.marginal() : null;
            kinds[i] = switch (valueKinds[i]) {
                case NUMBER, INTEGER -> CellKind.NUMBER;
                case BOOLEAN -> CellKind.BOOLEAN;
                case LABEL, DATE, TIMESTAMP -> CellKind.TEXT;
            };
        }
        DatasetStats stats = new DatasetStats(spec, compiled.model().order());
        Path dataPath = outputRoot.resolve(compiled.dataFile());
        Path reportPath = outputRoot.resolve(compiled.reportFile());
        boolean html = compiled.htmlReport();
        MessageDigest digest = Hashes.sha256();
        long bytes;
        try (AtomicFile data = AtomicFile.create(dataPath); AtomicFile report = AtomicFile.create(reportPath);
             AtomicFile page = html ? AtomicFile.create(outputRoot.resolve(compiled.htmlReportFile())) : null) {
            CountingStream counter;
            try (OutputStream file = Files.newOutputStream(data.temp());
                 Writer out = new BufferedWriter(new OutputStreamWriter(
                         counter = new CountingStream(new DigestOutputStream(file, digest)), StandardCharsets.UTF_8), 1 << 16)) {
                RowWriter writer = writer(spec.output(), out, names, kinds);
                writer.begin();
                double[] values = new double[k];
                double[] written = new double[k];
                boolean[] missing = new boolean[k];
                String[] cells = new String[k];
                for (long row = 0; row < spec.rows(); row++) {
                    sampler.draw(row, values, missing, scratch);
                    for (int i = 0; i < k; i++) {
                        if (missing[i]) {
                            cells[i] = null;
                            continue;
                        }
                        if (sampler.isSequence(i)) {
                            cells[i] = Long.toString(sampler.sequenceValue(i, row));
                            written[i] = values[i];
                        } else {
                            cells[i] = text(valueKinds[i], marginals[i], values[i], decimals[i]);
                            written[i] = valueKinds[i] == ValueKind.NUMBER && decimals[i] >= 0
                                    ? Double.parseDouble(cells[i]) : values[i];
                        }
                    }
                    stats.accept(row, written, missing);
                    writer.row(cells);
                    if (progress != null && (row + 1) % PROGRESS_EVERY == 0) {
                        progress.accept(row + 1);
                    }
                }
                writer.end();
            }
            bytes = counter.count();
            GenerationResult.WrittenFile dataFile = new GenerationResult.WrittenFile(compiled.dataFile(), bytes,
                    Hashes.hex(digest.digest()));
            List<Check> checks = FidelityChecks.of(spec, compiled.model(), stats);
            byte[] json = Report.build(compiled, dataFile, stats, checks).getBytes(StandardCharsets.UTF_8);
            Files.write(report.temp(), json);
            List<GenerationResult.WrittenFile> files = new ArrayList<>(List.of(dataFile));
            files.add(written(compiled.reportFile(), json));
            if (page != null) {
                byte[] htmlBytes = HtmlReport.build(compiled, stats, checks, Report.achieved(compiled, stats))
                        .getBytes(StandardCharsets.UTF_8);
                Files.write(page.temp(), htmlBytes);
                files.add(written(compiled.htmlReportFile(), htmlBytes));
            }
            data.commit();
            report.commit();
            if (page != null) {
                page.commit();
            }
            return new GenerationResult(spec.dataset(), spec.rows(), k, List.copyOf(files), note(compiled), List.copyOf(checks));
        }
    }

    private static GenerationResult.WrittenFile written(String path, byte[] bytes) {
        return new GenerationResult.WrittenFile(path, bytes.length, Hashes.sha256(bytes));
    }

    /** The written text of a value of the given kind. */
    static String text(ValueKind kind, Marginal m, double value, int decimals) {
        return switch (kind) {
            case NUMBER -> NumberText.format(value, decimals);
            case INTEGER -> Long.toString((long) value);
            case BOOLEAN -> value == 1.0 ? "true" : "false";
            case LABEL -> m.label((int) value);
            case DATE -> LocalDate.ofEpochDay((long) value).toString();
            case TIMESTAMP -> Instant.ofEpochSecond((long) value).toString();
        };
    }

    private static String note(CompiledSpec compiled) {
        var repair = compiled.model().targetRepair();
        var latent = compiled.model().latentRepair();
        if (repair != null && repair.repaired()) {
            return "correlation repaired (max change " + NumberText.fixed(repair.maxChange(), 4) + ")";
        }
        if (latent != null && latent.repaired()) {
            return "latent correlation repaired (max change " + NumberText.fixed(latent.maxChange(), 4) + ")";
        }
        return null;
    }

    private static RowWriter writer(OutputSpec output, Writer out, List<String> names, CellKind[] kinds) {
        return switch (output.format()) {
            case CSV -> new CsvRowWriter(out, names, kinds, output.header(), output.delimiter(), output.nullText());
            case JSON -> JsonRowWriter.array(out, names, kinds);
            case JSONL -> JsonRowWriter.lines(out, names, kinds);
        };
    }

    /** Counts the bytes passing through. */
    private static final class CountingStream extends java.io.FilterOutputStream {
        private long count;

        CountingStream(OutputStream out) {
            super(out);
        }

        @Override
        public void write(int b) throws IOException {
            out.write(b);
            count++;
        }

        @Override
        public void write(byte[] b, int off, int len) throws IOException {
            out.write(b, off, len);
            count += len;
        }

        long count() {
            return count;
        }
    }
}
