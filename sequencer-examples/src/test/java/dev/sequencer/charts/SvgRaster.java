package dev.sequencer.charts;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.Graphics2D;
import java.awt.RenderingHints;
import java.awt.Shape;
import java.awt.geom.AffineTransform;
import java.awt.geom.Path2D;
import java.awt.image.BufferedImage;
import java.io.ByteArrayInputStream;
import java.nio.charset.StandardCharsets;
import java.util.HashMap;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import javax.xml.parsers.DocumentBuilderFactory;
import org.w3c.dom.Document;
import org.w3c.dom.Element;
import org.w3c.dom.Node;
import org.w3c.dom.NodeList;

/**
 * A test-side SVG rasteriser for the subset of SVG 1.1 that {@link SvgGraphics} writes, so that a chart's
 * SVG can be compared pixel by pixel with the PNG Java2D draws of the same chart. It reads the document
 * with the JDK's XML parser and follows the SVG 1.1 specification's meaning of each attribute (paths,
 * paints, opacities, strokes, dashes, clip paths, text with its transform); it shares no code with
 * {@link SvgGraphics}. Anything else in the document (an element or attribute outside that subset) fails
 * the test, so the subset cannot grow unnoticed.
 */
final class SvgRaster {
  private static final Pattern NUMBER = Pattern.compile("-?[0-9]*\\.?[0-9]+(?:[eE][-+]?[0-9]+)?");
  private static final Pattern COMMAND = Pattern.compile("[MLQCZ]");

  private SvgRaster() {}

  /** The document drawn on a white image of its own size, anti-aliased. */
  static BufferedImage render(String svg) throws Exception {
    DocumentBuilderFactory f = DocumentBuilderFactory.newInstance();
    f.setNamespaceAware(true);
    Document doc = f.newDocumentBuilder().parse(new ByteArrayInputStream(svg.getBytes(StandardCharsets.UTF_8)));
    Element root = doc.getDocumentElement();
    int w = Integer.parseInt(root.getAttribute("width"));
    int h = Integer.parseInt(root.getAttribute("height"));
    BufferedImage img = new BufferedImage(w, h, BufferedImage.TYPE_INT_RGB);
    Graphics2D g = img.createGraphics();
    g.setColor(Color.WHITE);
    g.fillRect(0, 0, w, h);
    g.setRenderingHint(RenderingHints.KEY_ANTIALIASING, RenderingHints.VALUE_ANTIALIAS_ON);
    g.setRenderingHint(RenderingHints.KEY_TEXT_ANTIALIASING, RenderingHints.VALUE_TEXT_ANTIALIAS_ON);
    // JFreeChart draws its PNGs with pure stroke control (no snapping of lines to pixel centres): the same here.
    g.setRenderingHint(RenderingHints.KEY_STROKE_CONTROL, RenderingHints.VALUE_STROKE_PURE);
    Map<String, Shape> clips = new HashMap<>();
    NodeList cps = doc.getElementsByTagNameNS("*", "clipPath");
    for (int i = 0; i < cps.getLength(); i++) {
      Element cp = (Element) cps.item(i);
      Element p = (Element) cp.getElementsByTagNameNS("*", "path").item(0);
      clips.put(cp.getAttribute("id"), path(p.getAttribute("d")));
    }
    for (Node n = root.getFirstChild(); n != null; n = n.getNextSibling()) {
      if (n instanceof Element e) {
        draw(g, e, clips);
      }
    }
    g.dispose();
    return img;
  }

  private static void draw(Graphics2D g, Element e, Map<String, Shape> clips) {
    String clip = e.getAttribute("clip-path");
    g.setClip(clip.isEmpty() ? null : clips.get(clip.substring(5, clip.length() - 1)));
    switch (e.getLocalName()) {
      case "defs" -> { }
      case "path" -> drawPath(g, e);
      case "text" -> drawText(g, e);
      default -> throw new AssertionError("element outside the tested subset: " + e.getLocalName());
    }
  }

  private static void drawPath(Graphics2D g, Element e) {
    Path2D p = path(e.getAttribute("d"));
    if ("evenodd".equals(e.getAttribute("fill-rule"))) {
      p.setWindingRule(Path2D.WIND_EVEN_ODD);
    }
    String fill = e.getAttribute("fill");
    if (!fill.equals("none")) {
      g.setColor(color(fill, e.getAttribute("fill-opacity")));
      g.fill(p);
    }
    String stroke = e.getAttribute("stroke");
    if (!stroke.isEmpty()) {
      g.setColor(color(stroke, e.getAttribute("stroke-opacity")));
      g.setStroke(stroke(e));
      g.draw(p);
    }
  }

  private static BasicStroke stroke(Element e) {
    float width = Float.parseFloat(e.getAttribute("stroke-width"));
    int cap = switch (e.getAttribute("stroke-linecap")) {
      case "" -> BasicStroke.CAP_BUTT;
      case "round" -> BasicStroke.CAP_ROUND;
      case "square" -> BasicStroke.CAP_SQUARE;
      default -> throw new AssertionError(e.getAttribute("stroke-linecap"));
    };
    int join = switch (e.getAttribute("stroke-linejoin")) {
      case "" -> BasicStroke.JOIN_MITER;
      case "round" -> BasicStroke.JOIN_ROUND;
      case "bevel" -> BasicStroke.JOIN_BEVEL;
      default -> throw new AssertionError(e.getAttribute("stroke-linejoin"));
    };
    String ml = e.getAttribute("stroke-miterlimit");
    float miter = ml.isEmpty() ? 4f : Float.parseFloat(ml); // SVG 1.1, 11.4: initial value 4
    String da = e.getAttribute("stroke-dasharray");
    if (da.isEmpty()) {
      return new BasicStroke(width, cap, join, miter);
    }
    String[] parts = da.split(",");
    float[] dash = new float[parts.length];
    for (int i = 0; i < parts.length; i++) {
      dash[i] = Float.parseFloat(parts[i]);
    }
    String off = e.getAttribute("stroke-dashoffset");
    return new BasicStroke(width, cap, join, miter, dash, off.isEmpty() ? 0 : Float.parseFloat(off));
  }

  private static void drawText(Graphics2D g, Element e) {
    int style = ("bold".equals(e.getAttribute("font-weight")) ? Font.BOLD : 0)
        | ("italic".equals(e.getAttribute("font-style")) ? Font.ITALIC : 0);
    String family = switch (e.getAttribute("font-family")) {
      case "sans-serif" -> Font.SANS_SERIF;
      case "serif" -> Font.SERIF;
      case "monospace" -> Font.MONOSPACED;
      default -> throw new AssertionError("font family outside the tested subset: " + e.getAttribute("font-family"));
    };
    g.setFont(new Font(family, style, 1).deriveFont(Float.parseFloat(e.getAttribute("font-size"))));
    g.setColor(color(e.getAttribute("fill"), e.getAttribute("fill-opacity")));
    AffineTransform saved = g.getTransform();
    String t = e.getAttribute("transform");
    if (!t.isEmpty()) {
      double[] m = numbers(t.substring("matrix(".length(), t.length() - 1));
      g.transform(new AffineTransform(m));
    }
    g.drawString(e.getTextContent(), Float.parseFloat(e.getAttribute("x")), Float.parseFloat(e.getAttribute("y")));
    g.setTransform(saved);
  }

  private static Color color(String hex, String opacity) {
    if (!hex.matches("#[0-9a-f]{6}")) {
      throw new AssertionError("paint outside the tested subset: " + hex);
    }
    int rgb = Integer.parseInt(hex.substring(1), 16);
    int alpha = opacity.isEmpty() ? 255 : (int) Math.round(Double.parseDouble(opacity) * 255);
    return new Color((rgb >> 16) & 0xff, (rgb >> 8) & 0xff, rgb & 0xff, alpha);
  }

  /** Path data with absolute M, L, Q, C and Z commands (SVG 1.1, 8.3). */
  static Path2D path(String d) {
    Path2D.Double p = new Path2D.Double(Path2D.WIND_NON_ZERO);
    Matcher cm = COMMAND.matcher(d);
    int at = 0;
    char cmd = 0;
    while (at < d.length()) {
      if (!cm.find(at)) {
        apply(p, cmd, numbers(d.substring(at)));
        break;
      }
      if (cmd != 0) {
        apply(p, cmd, numbers(d.substring(at, cm.start())));
      }
      cmd = cm.group().charAt(0);
      at = cm.end();
    }
    if (cmd == 'Z' && at >= d.length()) {
      p.closePath();
    }
    return p;
  }

  private static void apply(Path2D p, char cmd, double[] c) {
    switch (cmd) {
      case 'M' -> p.moveTo(c[0], c[1]);
      case 'L' -> p.lineTo(c[0], c[1]);
      case 'Q' -> p.quadTo(c[0], c[1], c[2], c[3]);
      case 'C' -> p.curveTo(c[0], c[1], c[2], c[3], c[4], c[5]);
      case 'Z' -> p.closePath();
      default -> throw new AssertionError("path command outside the tested subset: " + cmd);
    }
  }

  static double[] numbers(String s) {
    Matcher m = NUMBER.matcher(s);
    double[] out = new double[8];
    int n = 0;
    while (m.find()) {
      out[n++] = Double.parseDouble(m.group());
    }
    return java.util.Arrays.copyOf(out, n);
  }
}
