package org.liepath.validation;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import javax.imageio.ImageIO;
import java.awt.image.BufferedImage;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The demo end to end into a temporary folder (no console: the log goes to a list). */
class DemoTest {

    @Test
    void demoWritesReportWithComputedFigures(@TempDir Path dir) throws Exception {
        List<String> log = new ArrayList<>();
        Demo.Outcome o = Demo.run(dir, log::add);
        assertTrue(log.get(0).startsWith("[1/7]"), log.toString());
        String md = Files.readString(dir.resolve(Report.SUMMARY));
        assertTrue(md.contains("invented"), "the scenario must be labelled as invented");
        for (Map.Entry<String, String> f : o.figures().entrySet()) {
            assertTrue(md.contains(f.getValue()), f.getKey() + " = " + f.getValue() + " missing from the summary");
        }
        for (String png : new String[]{"populations.png", "work-precision.png", "convergence.png", "purity-entropy.png"}) {
            BufferedImage img = ImageIO.read(dir.resolve(png).toFile());
            assertNotNull(img, png);
            assertEquals(800, img.getWidth(), png);
            assertEquals(500, img.getHeight(), png);
        }
        assertTrue(Files.readString(dir.resolve("schemes.csv")).startsWith("scheme,mode,steps"));
        // the numbers themselves: a Lie-group scheme keeps unitarity to rounding (exponentials of anti-Hermitian
        // matrices; common practice), the channel is trace preserving and completely positive within the documented
        // tolerances, and the published orders are observed (±0.3: fixed steps from 4–16 per [0, 10])
        assertTrue(Double.parseDouble(o.figures().get("largest scheme unitarity error")) < 1e-12);
        assertTrue(Double.parseDouble(o.figures().get("channel trace error")) < Checks.TRACE_TOLERANCE);
        assertTrue(Double.parseDouble(o.figures().get("channel Choi minimum eigenvalue")) > -1e-10);
        assertEquals(4.0, Double.parseDouble(o.figures().get("observed order Magnus 4 (2 Gauss nodes)")), 0.3);
        assertEquals(2.0, Double.parseDouble(o.figures().get("observed order exponential midpoint")), 0.3);
        double fClosed = Double.parseDouble(o.figures().get("gate fidelity (closed)"));
        double fOpen = Double.parseDouble(o.figures().get("gate fidelity (open)"));
        assertTrue(fOpen < fClosed && fClosed <= 1, "relaxation lowers the fidelity: " + fOpen + " vs " + fClosed);
    }
}
