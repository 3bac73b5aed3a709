package dev.sequencer.charts;

import java.awt.Graphics2D;
import java.util.Map;
import org.jfree.chart.ChartHints;

/**
 * Marks a part of a chart as a group through JFreeChart's element hints: {@link SvgGraphics} writes it as a
 * {@code <g>} with these attributes (so a reader, or a test, can tell which bar is which); other graphics
 * ignore the hints.
 */
final class SvgGroups {
  private SvgGroups() {}

  /** Runs {@code draw} inside a group with {@code attributes}; without a group when they are null. */
  static void around(Graphics2D g2, Map<String, String> attributes, Runnable draw) {
    if (attributes == null) {
      draw.run();
      return;
    }
    g2.setRenderingHint(ChartHints.KEY_BEGIN_ELEMENT, attributes);
    try {
      draw.run();
    } finally {
      g2.setRenderingHint(ChartHints.KEY_END_ELEMENT, Boolean.TRUE);
    }
  }
}
