package org.liepath.validation;

import org.knowm.xchart.BitmapEncoder;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYChartBuilder;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.style.Styler;
import org.knowm.xchart.style.markers.SeriesMarkers;
import org.liepath.core.InvalidInputException;
import org.liepath.core.InvalidInputException.Reason;
import org.liepath.core.internal.Require;

import java.io.IOException;
import java.io.OutputStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.regex.Pattern;

/**
 * A validation report: a folder with a Markdown summary ({@value #SUMMARY}) and PNG plots drawn with XChart.
 *
 * <p>Build it with {@link #builder(String)}: add headings, paragraphs, tables (for instance
 * {@link CrossCheck#toMarkdown()} or {@link ConvergenceStudy#toMarkdown()}) and {@link Plot}s, then
 * {@link Builder#write(Path)}. Rendering works without a display: PNGs are drawn into off-screen images, which is
 * safe with {@code -Djava.awt.headless=true} (set it on servers; the demo does). The written report is described by
 * the returned immutable {@code Report} (folder and files).
 *
 * <p>Line plots on logarithmic axes drop points that are not positive (they cannot be drawn there) and say so in
 * the series name. Builders are mutable and not thread-safe; the report itself is immutable.
 */
public final class Report {
    /** File name of the Markdown summary inside the report folder. */
    public static final String SUMMARY = "summary.md";

    private static final Pattern FILE_NAME = Pattern.compile("[A-Za-z0-9._-]+\\.png");

    private final Path folder;
    private final List<Path> files;

    private Report(Path folder, List<Path> files) {
        this.folder = folder;
        this.files = files;
    }

    /** @return the report folder */
    public Path folder() {
        return folder;
    }

    /** @return the summary file */
    public Path summary() {
        return folder.resolve(SUMMARY);
    }

    /** @return every file written (summary first, then the plots in the order added) */
    public List<Path> files() {
        return files;
    }

    /**
     * Starts a report with a title (the summary's first heading).
     *
     * @param title the title
     * @return a builder for the report
     */
    public static Builder builder(String title) {
        return new Builder(Require.nonNull(title, "title"));
    }

    /**
     * Starts a line plot, saved as a PNG of the given file name in the report folder.
     *
     * @param fileName a plain file name ending in .png (letters, digits, '.', '_', '-')
     * @param title the title
     * @param xLabel the label of the horizontal axis
     * @param yLabel the label of the vertical axis
     * @return a builder for the plot
     */
    public static Plot plot(String fileName, String title, String xLabel, String yLabel) {
        Require.nonNull(fileName, "fileName");
        if (!FILE_NAME.matcher(fileName).matches()) {
            throw InvalidInputException.of(Reason.SYNTAX, "fileName", "a plain name like plot-1.png", fileName);
        }
        return new Plot(fileName, Require.nonNull(title, "title"), Require.nonNull(xLabel, "xLabel"),
                Require.nonNull(yLabel, "yLabel"));
    }

    /** A line plot under construction: mutable, not thread-safe. */
    public static final class Plot {
        private final String fileName, title, xLabel, yLabel;
        private boolean logX, logY;
        private int width = 800, height = 500;
        private final List<String> names = new ArrayList<>();
        private final List<double[]> xs = new ArrayList<>(), ys = new ArrayList<>();
        private final List<Boolean> markers = new ArrayList<>();

        private Plot(String fileName, String title, String xLabel, String yLabel) {
            this.fileName = fileName;
            this.title = title;
            this.xLabel = xLabel;
            this.yLabel = yLabel;
        }

        /**
         * Logarithmic x axis.
         *
         * @return a copy with this setting
         */
        public Plot logX() {
            logX = true;
            return this;
        }

        /**
         * Logarithmic y axis.
         *
         * @return a copy with this setting
         */
        public Plot logY() {
            logY = true;
            return this;
        }

        /**
         * Image size in pixels (default 800 × 500; each 100 … 4000).
         *
         * @param width the width in pixels
         * @param height the height in pixels
         * @return a copy with this setting
         */
        public Plot size(int width, int height) {
            if (width < 100 || width > 4000 || height < 100 || height > 4000) {
                throw InvalidInputException.of(Reason.OUT_OF_RANGE, "size", "width and height in 100 … 4000",
                        width + " × " + height);
            }
            this.width = width;
            this.height = height;
            return this;
        }

        /**
         * Adds a series drawn as a line.
         *
         * @param name the name
         * @param x the abscissae
         * @param y the ordinates (same length as x)
         * @return a copy with this setting
         */
        public Plot line(String name, double[] x, double[] y) {
            return add(name, x, y, false);
        }

        /**
         * Adds a series drawn as a line with markers at the data points.
         *
         * @param name the name
         * @param x the abscissae
         * @param y the ordinates (same length as x)
         * @return a copy with this setting
         */
        public Plot points(String name, double[] x, double[] y) {
            return add(name, x, y, true);
        }

        private Plot add(String name, double[] x, double[] y, boolean marker) {
            Require.nonNull(name, "name");
            Require.finite(x, "x");
            Require.finite(y, "y");
            Require.sameDim(x.length, y.length, "y");
            if (names.contains(name)) {
                throw InvalidInputException.of(Reason.OUT_OF_RANGE, "name", "a series name not used yet", name);
            }
            names.add(name);
            xs.add(x.clone());
            ys.add(y.clone());
            markers.add(marker);
            return this;
        }

        /** @return the file name */
        public String fileName() {
            return fileName;
        }

        /** @return the title */
        public String title() {
            return title;
        }

        void render(OutputStream out) throws IOException {
            XYChart chart = new XYChartBuilder().width(width).height(height).title(title).xAxisTitle(xLabel)
                    .yAxisTitle(yLabel).build();
            chart.getStyler().setXAxisLogarithmic(logX).setYAxisLogarithmic(logY);
            chart.getStyler().setLegendPosition(Styler.LegendPosition.OutsideE);
            chart.getStyler().setMarkerSize(6);
            int drawn = 0;
            for (int s = 0; s < names.size(); s++) {
                double[] x = xs.get(s), y = ys.get(s);
                int keep = 0;
                for (int k = 0; k < x.length; k++) {
                    if ((!logX || x[k] > 0) && (!logY || y[k] > 0)) {
                        keep++;
                    }
                }
                if (keep == 0) {
                    continue;
                }
                double[] kx = new double[keep], ky = new double[keep];
                int j = 0;
                for (int k = 0; k < x.length; k++) {
                    if ((!logX || x[k] > 0) && (!logY || y[k] > 0)) {
                        kx[j] = x[k];
                        ky[j++] = y[k];
                    }
                }
                String label = keep < x.length ? names.get(s) + " (" + (x.length - keep) + " non-positive dropped)"
                        : names.get(s);
                XYSeries ser = chart.addSeries(label, kx, ky);
                ser.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Line);
                if (!markers.get(s)) {
                    ser.setMarker(SeriesMarkers.NONE);
                }
                drawn++;
            }
            if (drawn == 0) {
                // XChart cannot scale empty axes: draw an invisible placeholder so the image still exists
                XYSeries ser = chart.addSeries("no drawable data", new double[]{1, 2}, new double[]{1, 2});
                ser.setMarker(SeriesMarkers.NONE);
            }
            BitmapEncoder.saveBitmap(chart, out, BitmapEncoder.BitmapFormat.PNG);
        }
    }

    /** The report under construction: mutable, not thread-safe. */
    public static final class Builder {
        private final StringBuilder md = new StringBuilder();
        private final List<Plot> plots = new ArrayList<>();

        private Builder(String title) {
            md.append("# ").append(title).append("\n\n");
        }

        /**
         * Adds a second-level heading.
         *
         * @param text the text to parse
         * @return this builder
         */
        public Builder heading(String text) {
            md.append("## ").append(Require.nonNull(text, "text")).append("\n\n");
            return this;
        }

        /**
         * Adds a paragraph (Markdown allowed).
         *
         * @param text the text to parse
         * @return this builder
         */
        public Builder paragraph(String text) {
            md.append(Require.nonNull(text, "text").strip()).append("\n\n");
            return this;
        }

        /**
         * Adds preformatted text (a code block).
         *
         * @param text the text to parse
         * @return this builder
         */
        public Builder preformatted(String text) {
            md.append("```\n").append(Require.nonNull(text, "text").stripTrailing()).append("\n```\n\n");
            return this;
        }

        /**
         * Adds a Markdown table (for instance {@link CrossCheck#toMarkdown()}).
         *
         * @param markdownTable the table in Markdown
         * @return this builder
         */
        public Builder table(String markdownTable) {
            md.append(Require.nonNull(markdownTable, "markdownTable").strip()).append("\n\n");
            return this;
        }

        /**
         * Adds a plot: rendered at {@link #write}, and shown in the summary under its title.
         *
         * @param plot the plot
         * @return this builder
         */
        public Builder figure(Plot plot) {
            Require.nonNull(plot, "plot");
            for (Plot p : plots) {
                if (p.fileName.equals(plot.fileName)) {
                    throw InvalidInputException.of(Reason.OUT_OF_RANGE, "plot", "a file name not used yet",
                            plot.fileName);
                }
            }
            plots.add(plot);
            md.append("![").append(plot.title).append("](").append(plot.fileName).append(")\n\n");
            return this;
        }

        /** @return the summary text as it stands */
        public String markdown() {
            return md.toString();
        }

        /**
         * Creates the folder (and parents) if needed and writes the summary and every plot, replacing files of the
         * same names.
         *
         * @param folder the folder
         * @return a copy with this setting
         * @throws UncheckedIOException if a file cannot be written
         */
        public Report write(Path folder) {
            Require.nonNull(folder, "folder");
            List<Path> files = new ArrayList<>();
            try {
                Files.createDirectories(folder);
                Path summary = folder.resolve(SUMMARY);
                Files.writeString(summary, md.toString(), StandardCharsets.UTF_8);
                files.add(summary);
                for (Plot p : plots) {
                    Path f = folder.resolve(p.fileName);
                    try (OutputStream out = Files.newOutputStream(f)) {
                        p.render(out);
                    }
                    files.add(f);
                }
            } catch (IOException e) {
                throw new UncheckedIOException("cannot write the report to " + folder, e);
            }
            return new Report(folder, List.copyOf(files));
        }
    }
}
