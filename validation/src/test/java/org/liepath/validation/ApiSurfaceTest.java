package org.liepath.validation;

import org.junit.jupiter.api.Test;

import java.io.IOException;
import java.lang.reflect.Constructor;
import java.lang.reflect.Field;
import java.lang.reflect.Method;
import java.lang.reflect.Modifier;
import java.lang.reflect.Type;
import java.net.URISyntaxException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.Paths;
import java.util.ArrayList;
import java.util.List;
import java.util.jar.JarFile;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The public API never exposes implementation detail: no public or protected member of a public type in an API
 * package (org.liepath.core, .algebra, .integrators, .validation) mentions a type from an {@code internal} package,
 * and every API package has a package-info.java guide. (Common practice for libraries that separate API from
 * internals; the jars declare Automatic-Module-Names instead of module-info.)
 */
class ApiSurfaceTest {
    private static final String[] ANCHORS = {"org.liepath.core.Operator", "org.liepath.algebra.LieAlgebra",
        "org.liepath.integrators.Evolve", "org.liepath.validation.Checks"};

    @Test
    void noInternalTypeInAnyPublicSignature() throws Exception {
        List<String> offences = new ArrayList<>();
        int checked = 0;
        for (String anchor : ANCHORS) {
            for (Class<?> c : apiClasses(Class.forName(anchor))) {
                checked++;
                inspect(c, offences);
            }
        }
        assertTrue(checked > 20, "expected to inspect the API classes, found " + checked);
        assertEquals(List.of(), offences, "public signatures mention internal types");
    }

    @Test
    void everyApiPackageHasAGuide() throws Exception {
        for (String anchor : ANCHORS) {
            Package p = Class.forName(anchor).getPackage();
            Class<?> info = null;
            try {
                info = Class.forName(p.getName() + ".package-info");
            } catch (ClassNotFoundException e) {
                // reported below
            }
            assertTrue(info != null, "missing package-info.java in " + p.getName());
        }
    }

    private static void inspect(Class<?> c, List<String> offences) {
        if (!Modifier.isPublic(c.getModifiers())) {
            return;
        }
        check(c.getGenericSuperclass(), c.getName() + " extends", offences);
        for (Type t : c.getGenericInterfaces()) {
            check(t, c.getName() + " implements", offences);
        }
        for (Method m : c.getDeclaredMethods()) {
            if (!visible(m.getModifiers()) || m.isSynthetic()) {
                continue;
            }
            check(m.getGenericReturnType(), c.getName() + "." + m.getName() + " returns", offences);
            for (Type t : m.getGenericParameterTypes()) {
                check(t, c.getName() + "." + m.getName() + " parameter", offences);
            }
        }
        for (Constructor<?> k : c.getDeclaredConstructors()) {
            if (!visible(k.getModifiers()) || k.isSynthetic()) {
                continue;
            }
            for (Type t : k.getGenericParameterTypes()) {
                check(t, c.getName() + " constructor parameter", offences);
            }
        }
        for (Field f : c.getDeclaredFields()) {
            if (visible(f.getModifiers()) && !f.isSynthetic()) {
                check(f.getGenericType(), c.getName() + "." + f.getName(), offences);
            }
        }
    }

    private static boolean visible(int mod) {
        return Modifier.isPublic(mod) || Modifier.isProtected(mod);
    }

    private static void check(Type t, String where, List<String> offences) {
        if (t == null) {
            return;
        }
        String s = t.getTypeName();
        if (s.contains(".internal.")) {
            offences.add(where + " " + s);
        }
    }

    /** Public top-level and nested classes of the anchor's package (not its internal sub-packages). */
    private static List<Class<?>> apiClasses(Class<?> anchor) throws IOException, URISyntaxException, ClassNotFoundException {
        String pkg = anchor.getPackage().getName();
        String dir = pkg.replace('.', '/');
        Path loc = Paths.get(anchor.getProtectionDomain().getCodeSource().getLocation().toURI());
        List<String> names = new ArrayList<>();
        if (Files.isDirectory(loc)) {
            try (Stream<Path> s = Files.list(loc.resolve(dir))) {
                s.map(p -> p.getFileName().toString()).filter(n -> n.endsWith(".class")).forEach(names::add);
            }
        } else {
            try (JarFile jar = new JarFile(loc.toFile())) {
                jar.stream().map(e -> e.getName())
                        .filter(n -> n.startsWith(dir + "/") && n.endsWith(".class") && n.indexOf('/', dir.length() + 1) < 0)
                        .forEach(n -> names.add(n.substring(dir.length() + 1)));
            }
        }
        List<Class<?>> out = new ArrayList<>();
        for (String n : names) {
            if (n.equals("package-info.class")) {
                continue;
            }
            out.add(Class.forName(pkg + "." + n.substring(0, n.length() - ".class".length()), false,
                    ApiSurfaceTest.class.getClassLoader()));
        }
        return out;
    }
}
