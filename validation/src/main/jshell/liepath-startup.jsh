// Liepath JShell start-up: the library's API packages and the complex scalar type.
// From the repository root, after `mvn -B -q -DskipTests package -pl validation -am`:
//   jshell --class-path validation/target/liepath-all.jar --startup DEFAULT --startup validation/src/main/jshell/liepath-startup.jsh
import java.util.*;
import org.apache.commons.math3.complex.Complex;
import org.liepath.core.*;
import org.liepath.algebra.*;
import org.liepath.integrators.*;
import org.liepath.validation.*;
