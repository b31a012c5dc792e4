package org.liepath.validation;

import jdk.jshell.JShell;
import jdk.jshell.Snippet;
import jdk.jshell.SnippetEvent;
import jdk.jshell.SourceCodeAnalysis;
import org.junit.jupiter.api.Test;

import java.io.ByteArrayOutputStream;
import java.io.File;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.stream.Collectors;

import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

/**
 * Runs the JShell start-up file and the example script through the JDK's jdk.jshell API with the test class path,
 * snippet by snippet, and fails on any rejected snippet (compile error) or exception. Keeps the JShell path from
 * rotting as the API changes.
 */
class JShellScriptTest {
    private static final Path DIR = Path.of("src/main/jshell");

    @Test
    void startupAndExampleRunCleanly() throws Exception {
        ByteArrayOutputStream buf = new ByteArrayOutputStream();
        PrintStream out = new PrintStream(buf, true, StandardCharsets.UTF_8);
        try (JShell js = JShell.builder().out(out).err(out).build()) {
            for (String entry : System.getProperty("java.class.path").split(File.pathSeparator)) {
                if (!entry.isBlank()) {
                    js.addToClasspath(entry);
                }
            }
            evalAll(js, Files.readString(DIR.resolve("liepath-startup.jsh")), "liepath-startup.jsh", buf);
            // JShell commands such as the closing /exit are for the jshell tool, not snippets: drop them here
            String example = Files.readString(DIR.resolve("example.jsh")).lines()
                    .filter(line -> !line.startsWith("/")).collect(Collectors.joining("\n"));
            evalAll(js, example, "example.jsh", buf);
        }
        String printed = buf.toString(StandardCharsets.UTF_8);
        assertTrue(printed.contains("unitarity error"), printed);
        assertTrue(printed.contains("type "), printed);
    }

    /**
     * Feeds the source line by line as the jshell tool does: a snippet runs as soon as the lines read so far form a
     * complete one, so a statement continued on the next line must leave its first line incomplete.
     */
    private static void evalAll(JShell js, String source, String file, ByteArrayOutputStream buf) {
        SourceCodeAnalysis sca = js.sourceCodeAnalysis();
        StringBuilder pending = new StringBuilder();
        int lineNo = 0;
        for (String line : source.split("\n", -1)) {
            lineNo++;
            pending.append(line).append('\n');
            SourceCodeAnalysis.CompletionInfo ci = sca.analyzeCompletion(pending.toString());
            if (ci.completeness() == SourceCodeAnalysis.Completeness.EMPTY) {
                pending.setLength(0);
                continue;
            }
            if (!ci.completeness().isComplete()) {
                continue;
            }
            String snippet = ci.source();
            for (SnippetEvent e : js.eval(snippet)) {
                if (e.status() == Snippet.Status.REJECTED) {
                    String diags = js.diagnostics(e.snippet()).map(d -> d.getMessage(null))
                            .collect(Collectors.joining("; "));
                    fail(file + ":" + lineNo + ": snippet rejected: " + snippet.strip() + " — " + diags);
                }
                if (e.exception() != null) {
                    fail(file + ":" + lineNo + ": snippet threw " + e.exception() + ": " + snippet.strip()
                            + "\noutput so far:\n" + buf.toString(StandardCharsets.UTF_8));
                }
            }
            pending.setLength(0);
            pending.append(ci.remaining());
        }
        if (!pending.toString().isBlank()) {
            fail(file + ": incomplete snippet at end of file: " + pending.toString().strip());
        }
    }
}
