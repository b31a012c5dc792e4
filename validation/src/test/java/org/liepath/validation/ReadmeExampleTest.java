package org.liepath.validation;

import org.junit.jupiter.api.Test;

import javax.tools.JavaCompiler;
import javax.tools.ToolProvider;
import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.lang.reflect.Method;
import java.net.URL;
import java.net.URLClassLoader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.Paths;
import java.util.ArrayList;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The README's Java example compiles against the current API and runs without error, so the front door cannot rot.
 */
class ReadmeExampleTest {
    @Test
    void readmeJavaExampleCompilesAndRuns() throws Exception {
        Path readme = Paths.get("..", "README.md");
        assertTrue(Files.exists(readme), "README.md not found from " + Paths.get("").toAbsolutePath());
        List<String> lines = Files.readAllLines(readme, StandardCharsets.UTF_8);
        List<String> imports = new ArrayList<>(), body = new ArrayList<>();
        boolean in = false, found = false;
        for (String line : lines) {
            if (!found && line.trim().equals("```java")) {
                in = true;
                found = true;
                continue;
            }
            if (in && line.trim().equals("```")) {
                break;
            }
            if (in) {
                (line.startsWith("import ") ? imports : body).add(line);
            }
        }
        assertTrue(found && !body.isEmpty(), "README has no java code block");
        String src = String.join("\n", imports) + "\npublic class ReadmeExample {\n"
                + "    public static void main(String[] args) throws Exception {\n" + String.join("\n", body)
                + "\n    }\n}\n";
        Path dir = Files.createTempDirectory("readme-example");
        Path file = dir.resolve("ReadmeExample.java");
        Files.writeString(file, src);
        JavaCompiler javac = ToolProvider.getSystemJavaCompiler();
        assertNotNull(javac, "a JDK (not a JRE) is required to run this test");
        ByteArrayOutputStream diag = new ByteArrayOutputStream();
        int rc = javac.run(null, null, new PrintStream(diag, true, StandardCharsets.UTF_8),
                "-classpath", System.getProperty("java.class.path"), "-d", dir.toString(), file.toString());
        assertEquals(0, rc, "README example does not compile:\n" + diag.toString(StandardCharsets.UTF_8) + "\n" + src);
        try (URLClassLoader loader = new URLClassLoader(new URL[]{dir.toUri().toURL()}, getClass().getClassLoader())) {
            Method main = loader.loadClass("ReadmeExample").getMethod("main", String[].class);
            PrintStream out = System.out;
            ByteArrayOutputStream captured = new ByteArrayOutputStream();
            System.setOut(new PrintStream(captured, true, StandardCharsets.UTF_8));
            try {
                main.invoke(null, (Object) new String[0]);
            } finally {
                System.setOut(out);
            }
            String printed = captured.toString(StandardCharsets.UTF_8);
            assertTrue(printed.contains("su(2)"), "the example should report su(2), printed:\n" + printed);
            assertTrue(printed.contains("full unitary: true"), printed);
        }
    }
}
