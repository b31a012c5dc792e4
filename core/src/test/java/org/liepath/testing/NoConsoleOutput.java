package org.liepath.testing;

import org.junit.jupiter.api.extension.AfterEachCallback;
import org.junit.jupiter.api.extension.BeforeEachCallback;
import org.junit.jupiter.api.extension.ExtensionContext;

import java.io.OutputStream;
import java.io.PrintStream;
import java.net.URL;
import java.security.CodeSource;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;

/**
 * Fails every test during which Liepath library code writes to System.out or System.err: an embeddable library must
 * print nothing on its own (logging goes through System.Logger). Writes made by test code itself are allowed and
 * passed through.
 *
 * <p>Registered for every test of every module through JUnit's extension auto-detection (the parent pom enables it;
 * the service file ships in the core test-jar). A write counts as the library's when the nearest {@code org.liepath}
 * frame on the stack belongs to a class loaded from main (not test) classes.
 */
public final class NoConsoleOutput implements BeforeEachCallback, AfterEachCallback {
    private static final ExtensionContext.Namespace NS = ExtensionContext.Namespace.create(NoConsoleOutput.class);
    private static final ThreadLocal<Boolean> ACTIVE = ThreadLocal.withInitial(() -> false);

    /** @return whether the guard is installed for the test running on this thread */
    static boolean isActive() {
        return ACTIVE.get();
    }

    @Override
    public void beforeEach(ExtensionContext context) {
        if (exempt(context)) {
            return;
        }
        List<String> offences = Collections.synchronizedList(new ArrayList<>());
        PrintStream out = System.out, err = System.err;
        context.getStore(NS).put("out", out);
        context.getStore(NS).put("err", err);
        context.getStore(NS).put("offences", offences);
        System.setOut(new PrintStream(new Watch(out, "System.out", offences), true));
        System.setErr(new PrintStream(new Watch(err, "System.err", offences), true));
        ACTIVE.set(true);
    }

    @Override
    public void afterEach(ExtensionContext context) {
        if (exempt(context)) {
            return;
        }
        ACTIVE.set(false);
        ExtensionContext.Store store = context.getStore(NS);
        PrintStream out = store.get("out", PrintStream.class), err = store.get("err", PrintStream.class);
        if (out != null) {
            System.setOut(out);
        }
        if (err != null) {
            System.setErr(err);
        }
        @SuppressWarnings("unchecked")
        List<String> offences = store.get("offences", List.class);
        if (offences != null && !offences.isEmpty()) {
            throw new AssertionError("library code wrote to the console during this test: " + offences.get(0)
                    + (offences.size() > 1 ? " (and " + (offences.size() - 1) + " more writes)" : ""));
        }
    }

    private static boolean exempt(ExtensionContext c) {
        return c.getTestMethod().map(m -> m.isAnnotationPresent(AllowConsoleOutput.class)).orElse(false)
                || c.getTestClass().map(k -> k.isAnnotationPresent(AllowConsoleOutput.class)).orElse(false);
    }

    /** Passes bytes through, recording the first library frame that wrote. */
    static final class Watch extends OutputStream {
        private final PrintStream target;
        private final String name;
        private final List<String> offences;

        Watch(PrintStream target, String name, List<String> offences) {
            this.target = target;
            this.name = name;
            this.offences = offences;
        }

        @Override
        public void write(int b) {
            check();
            target.write(b);
        }

        @Override
        public void write(byte[] b, int off, int len) {
            check();
            target.write(b, off, len);
        }

        @Override
        public void flush() {
            target.flush();
        }

        private void check() {
            for (StackTraceElement e : Thread.currentThread().getStackTrace()) {
                String cls = e.getClassName();
                if (!cls.startsWith("org.liepath.") || cls.startsWith("org.liepath.testing.")) {
                    continue;
                }
                if (isMainClass(cls)) {
                    offences.add(name + " from " + e);
                }
                return;
            }
        }

        static boolean isMainClass(String cls) {
            try {
                Class<?> k = Class.forName(cls, false, Thread.currentThread().getContextClassLoader());
                CodeSource cs = k.getProtectionDomain().getCodeSource();
                URL url = cs == null ? null : cs.getLocation();
                String loc = url == null ? "" : url.toString();
                return !(loc.contains("test-classes") || loc.endsWith("-tests.jar"));
            } catch (ClassNotFoundException | LinkageError ex) {
                return false;
            }
        }
    }
}
