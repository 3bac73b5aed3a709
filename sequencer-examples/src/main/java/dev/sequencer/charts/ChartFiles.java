package dev.sequencer.charts;

import dev.sequencer.io.AtomicFiles;
import java.awt.Rectangle;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
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

  /** Longest part of a file name made from an id, characters. */
  private static final int NAME_PART_MAX = 60;

  /**
   * Each id as a part of a file name (a resource's sky chart, an HTML id), in the order given: letters,
   * digits, '-' and '_' kept, every other character (a dot, a slash, a space, a non-ASCII letter) replaced by
   * '_', cut at 60 characters; when two ids would give the same part (letter case ignored, for file systems
   * that ignore it), the later one gets "-2", "-3", ... after it.
   */
  public static Map<String, String> fileNames(List<String> ids) {
    Map<String, String> out = new LinkedHashMap<>();
    Set<String> used = new HashSet<>();
    for (String id : ids) {
      String base = id.replaceAll("[^A-Za-z0-9_-]", "_");
      base = base.isEmpty() ? "_" : base.substring(0, Math.min(base.length(), NAME_PART_MAX));
      String name = base;
      for (int k = 2; !used.add(name.toLowerCase(Locale.ROOT)); k++) {
        name = base + "-" + k;
      }
      out.put(id, name);
    }
    return out;
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
