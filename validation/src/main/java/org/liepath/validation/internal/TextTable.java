package org.liepath.validation.internal;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * A small table of strings that prints with aligned columns (for JShell and reports), as Markdown, or as CSV
 * (RFC 4180 quoting). Mutable while being filled; not thread-safe. Not part of the public API.
 */
public final class TextTable {
    private final List<String> header;
    private final List<List<String>> rows = new ArrayList<>();

    public TextTable(String... header) {
        this.header = List.of(header);
    }

    public TextTable add(Object... cells) {
        List<String> r = new ArrayList<>(cells.length);
        for (Object c : cells) {
            r.add(String.valueOf(c));
        }
        rows.add(r);
        return this;
    }

    /** Formats a number compactly: 4 significant digits in scientific notation, or "—" for NaN. */
    public static String sci(double v) {
        return Double.isNaN(v) ? "—" : String.format(Locale.ROOT, "%.3e", v);
    }

    /** Formats a number with the given decimals, or "—" for NaN. */
    public static String fixed(double v, int decimals) {
        return Double.isNaN(v) ? "—" : String.format(Locale.ROOT, "%." + decimals + "f", v);
    }

    private int[] widths() {
        int[] w = new int[header.size()];
        for (int c = 0; c < w.length; c++) {
            w[c] = header.get(c).length();
            for (List<String> r : rows) {
                w[c] = Math.max(w[c], r.get(c).length());
            }
        }
        return w;
    }

    /** @return aligned plain text, one line per row, header underlined */
    public String text() {
        int[] w = widths();
        StringBuilder sb = new StringBuilder();
        line(sb, header, w, "  ");
        for (int c = 0; c < w.length; c++) {
            sb.append("-".repeat(w[c])).append(c + 1 < w.length ? "  " : "\n");
        }
        for (List<String> r : rows) {
            line(sb, r, w, "  ");
        }
        return sb.toString();
    }

    /** @return a GitHub-flavoured Markdown table */
    public String markdown() {
        StringBuilder sb = new StringBuilder("| ").append(String.join(" | ", header)).append(" |\n|");
        for (int c = 0; c < header.size(); c++) {
            sb.append("---|");
        }
        sb.append('\n');
        for (List<String> r : rows) {
            sb.append("| ").append(String.join(" | ", r)).append(" |\n");
        }
        return sb.toString();
    }

    /** @return CSV with a header line */
    public String csv() {
        StringBuilder sb = new StringBuilder();
        csvLine(sb, header);
        for (List<String> r : rows) {
            csvLine(sb, r);
        }
        return sb.toString();
    }

    private static void line(StringBuilder sb, List<String> cells, int[] w, String sep) {
        for (int c = 0; c < w.length; c++) {
            String s = cells.get(c);
            sb.append(s).append(" ".repeat(w[c] - s.length()));
            sb.append(c + 1 < w.length ? sep : "\n");
        }
    }

    private static void csvLine(StringBuilder sb, List<String> cells) {
        for (int c = 0; c < cells.size(); c++) {
            String s = cells.get(c);
            if (s.contains(",") || s.contains("\"") || s.contains("\n")) {
                s = "\"" + s.replace("\"", "\"\"") + "\"";
            }
            sb.append(s).append(c + 1 < cells.size() ? "," : "\n");
        }
    }
}
