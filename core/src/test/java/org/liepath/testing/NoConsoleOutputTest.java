package org.liepath.testing;

import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The console guard is installed for every test and tells library classes from test classes. */
class NoConsoleOutputTest {
    @Test
    void guardIsInstalledForEveryTest() {
        assertTrue(NoConsoleOutput.isActive(), "NoConsoleOutput must be auto-registered (see the parent pom)");
    }

    @Test
    void libraryClassesAreToldFromTestClasses() {
        assertTrue(NoConsoleOutput.Watch.isMainClass("org.liepath.core.Operator"));
        assertFalse(NoConsoleOutput.Watch.isMainClass(NoConsoleOutputTest.class.getName()));
    }
}
