package dev.sequencer.charts;

import dev.sequencer.io.AtomicFiles;
import java.awt.Rectangle;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import org.jfree.chart.ChartUtils;
import org.jfree.chart.JFreeChart;

/** Writes a chart as PNG (JFreeChart's encoder) and SVG (our {@link SvgGraphics}), each atomically. */
public final class ChartFiles {
  private ChartFiles() {}

  static {
    // Charts are drawn off screen; never try to open a display (CI machines and servers have none).
    System.setProperty("java.awt.headless", "true");
  }

  /** Makes sure AWT runs headless; call before creating any chart. */
  public static void headless() {
    // the static initialiser above does the work; this method only forces it to run
  }

  /** Writes {@code chart} as a {@code widthPx} x {@code heightPx} PNG to {@code file}. */
  public static void png(JFreeChart chart, int widthPx, int heightPx, Path file) {
    ByteArrayOutputStream bytes = new ByteArrayOutputStream();
    try {
      ChartUtils.writeChartAsPNG(bytes, chart, widthPx, heightPx);
    } catch (IOException e) {
      throw new UncheckedIOException("cannot encode " + file, e);
    }
    AtomicFiles.writeBytes(file, bytes.toByteArray());
  }

  /** Writes {@code chart} as a {@code widthPx} x {@code heightPx} SVG document to {@code file}. */
  public static void svg(JFreeChart chart, int widthPx, int heightPx, Path file) {
    AtomicFiles.writeBytes(file, svgDocument(chart, widthPx, heightPx).getBytes(StandardCharsets.UTF_8));
  }

  /** {@code chart} as the text of a standalone SVG document. */
  public static String svgDocument(JFreeChart chart, int widthPx, int heightPx) {
    SvgGraphics g = new SvgGraphics(widthPx, heightPx);
    chart.draw(g, new Rectangle(0, 0, widthPx, heightPx));
    g.dispose();
    return g.document();
  }

  /**
   * {@code chart} as an {@code <svg>} element to place inside an HTML page (no XML declaration), scaled
   * to the page's width by its viewBox; {@code id} becomes the element's id (ids of its clip paths and
   * gradients are prefixed with it, so several charts can share one page).
   */
  public static String svgInline(JFreeChart chart, int widthPx, int heightPx, String id) {
    String doc = svgDocument(chart, widthPx, heightPx);
    String body = doc.substring(doc.indexOf("<svg"));
    body = body.replace("id=\"clip", "id=\"" + id + "-clip").replace("url(#clip", "url(#" + id + "-clip")
        .replace("id=\"gradient", "id=\"" + id + "-gradient").replace("url(#gradient", "url(#" + id + "-gradient");
    return body.replaceFirst("<svg ", "<svg id=\"" + id + "\" class=\"chart\" role=\"img\" ")
        .replaceFirst(" width=\"" + widthPx + "\" height=\"" + heightPx + "\"", "");
  }
}
