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
            evalAll(js, Files.readString(DIR.resolve("example.jsh")), "example.jsh", buf);
        }
        String printed = buf.toString(StandardCharsets.UTF_8);
        assertTrue(printed.contains("unitarity error"), printed);
        assertTrue(printed.contains("type "), printed);
    }

    private static void evalAll(JShell js, String source, String file, ByteArrayOutputStream buf) {
        String rest = source;
        SourceCodeAnalysis sca = js.sourceCodeAnalysis();
        while (true) {
            SourceCodeAnalysis.CompletionInfo ci = sca.analyzeCompletion(rest);
            if (ci.completeness() == SourceCodeAnalysis.Completeness.EMPTY) {
                return;
            }
            if (!ci.completeness().isComplete()) {
                fail(file + ": incomplete snippet at end of file: " + rest.strip());
            }
            String snippet = ci.source();
            for (SnippetEvent e : js.eval(snippet)) {
                if (e.status() == Snippet.Status.REJECTED) {
                    String diags = js.diagnostics(e.snippet()).map(d -> d.getMessage(null))
                            .collect(Collectors.joining("; "));
                    fail(file + ": snippet rejected: " + snippet.strip() + " — " + diags);
                }
                if (e.exception() != null) {
                    fail(file + ": snippet threw " + e.exception() + ": " + snippet.strip() + "\noutput so far:\n"
                            + buf.toString(StandardCharsets.UTF_8));
                }
            }
            rest = ci.remaining();
        }
    }
}
