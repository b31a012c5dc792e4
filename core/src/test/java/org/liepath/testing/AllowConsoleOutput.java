package org.liepath.testing;

import java.lang.annotation.ElementType;
import java.lang.annotation.Retention;
import java.lang.annotation.RetentionPolicy;
import java.lang.annotation.Target;

/**
 * Exempts a test class or method from {@link NoConsoleOutput}: for tests of applications (the demo's console
 * progress) where printing is the point.
 */
@Retention(RetentionPolicy.RUNTIME)
@Target({ElementType.TYPE, ElementType.METHOD})
public @interface AllowConsoleOutput {
}
