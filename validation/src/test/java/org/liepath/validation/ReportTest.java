package org.liepath.validation;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.liepath.core.InvalidInputException;

import javax.imageio.ImageIO;
import java.awt.image.BufferedImage;
import java.nio.file.Files;
import java.nio.file.Path;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class ReportTest {

    /** A report with a table and two plots: the files exist, the PNGs decode at the requested size (javax.imageio). */
    @Test
    void writesSummaryAndDecodablePngs(@TempDir Path dir) throws Exception {
        Report.Plot lin = Report.plot("lin.png", "Linear", "x", "y").size(640, 400)
                .line("a", new double[]{0, 1, 2}, new double[]{0, 1, 4});
        Report.Plot log = Report.plot("log.png", "Log", "x", "y").logX().logY()
                .points("with a zero", new double[]{1, 2, 4}, new double[]{1e-3, 0, 1e-5});
        Report r = Report.builder("Title").heading("Part").paragraph("Some *text* 1.234e-05.")
                .table("| a | b |\n|---|---|\n| 1 | 2 |").preformatted("x = 1").figure(lin).figure(log)
                .write(dir.resolve("out"));
        assertEquals(3, r.files().size());
        String md = Files.readString(r.summary());
        assertTrue(md.startsWith("# Title\n"), md);
        assertTrue(md.contains("## Part") && md.contains("1.234e-05") && md.contains("![Linear](lin.png)"), md);
        BufferedImage a = ImageIO.read(dir.resolve("out/lin.png").toFile());
        assertNotNull(a);
        assertEquals(640, a.getWidth());
        assertEquals(400, a.getHeight());
        BufferedImage b = ImageIO.read(dir.resolve("out/log.png").toFile());
        assertEquals(800, b.getWidth());
        assertEquals(500, b.getHeight());
    }

    @Test
    void badInput() {
        InvalidInputException name = assertThrows(InvalidInputException.class,
                () -> Report.plot("../evil.png", "t", "x", "y"));
        assertEquals(InvalidInputException.Reason.SYNTAX, name.reason());
        assertTrue(name.getMessage().contains("fileName") && name.getMessage().contains("../evil.png"));
        Report.Plot p = Report.plot("p.png", "t", "x", "y");
        InvalidInputException len = assertThrows(InvalidInputException.class,
                () -> p.line("s", new double[]{1, 2}, new double[]{1}));
        assertEquals(InvalidInputException.Reason.DIMENSION_MISMATCH, len.reason());
        assertThrows(InvalidInputException.class, () -> p.line("s", new double[]{Double.NaN}, new double[]{1}));
        p.line("s", new double[]{1}, new double[]{1});
        assertThrows(InvalidInputException.class, () -> p.line("s", new double[]{1}, new double[]{1}));
        assertThrows(InvalidInputException.class, () -> p.size(50, 500));
        Report.Builder b = Report.builder("t").figure(p);
        assertThrows(InvalidInputException.class, () -> b.figure(Report.plot("p.png", "again", "x", "y")));
    }
}
