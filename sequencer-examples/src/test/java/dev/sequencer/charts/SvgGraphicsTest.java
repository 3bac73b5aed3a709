package dev.sequencer.charts;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.cli.SequencerCli;
import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.GradientPaint;
import java.awt.RadialGradientPaint;
import java.awt.Rectangle;
import java.awt.geom.Rectangle2D;
import java.awt.image.BufferedImage;
import java.io.ByteArrayInputStream;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import javax.imageio.ImageIO;
import javax.xml.parsers.DocumentBuilderFactory;
import org.jfree.chart.ChartHints;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.w3c.dom.Document;
import org.w3c.dom.Element;
import org.w3c.dom.NodeList;

class SvgGraphicsTest {
  static {
    ChartFiles.headless();
  }

  private static Document parse(String svg) throws Exception {
    DocumentBuilderFactory f = DocumentBuilderFactory.newInstance();
    f.setNamespaceAware(true);
    return f.newDocumentBuilder().parse(new ByteArrayInputStream(svg.getBytes(StandardCharsets.UTF_8)));
  }

  private static Element only(Document d, String tag) {
    NodeList l = d.getElementsByTagNameNS("http://www.w3.org/2000/svg", tag);
    assertEquals(1, l.getLength(), "one <" + tag + ">");
    return (Element) l.item(0);
  }

  @Test
  void numbersHaveTwoDecimalsAtMostAndNeverMinusZero() {
    assertEquals("12.5", SvgDocument.number(12.5));
    assertEquals("0.01", SvgDocument.number(0.005));
    assertEquals("0", SvgDocument.number(-0.004));
    assertEquals("-3.25", SvgDocument.number(-3.25));
    assertEquals("10000000000", SvgDocument.number(1e10));
    assertEquals("0", SvgDocument.number(Double.NaN));
  }

  @Test
  void textIsEscapedAndCharactersXmlForbidsAreDropped() throws Exception {
    SvgGraphics g = new SvgGraphics(100, 50);
    g.drawString("a < b & \"c\" \u0001", 5, 20);
    Element t = only(parse(g.document()), "text");
    assertEquals("a < b & \"c\" ", t.getTextContent());
  }

  @Test
  void filledRectangleIsInDevicePixelsWithItsOpacity() throws Exception {
    SvgGraphics g = new SvgGraphics(200, 100);
    g.translate(10, 20);
    g.scale(2, 2);
    g.setPaint(new Color(255, 0, 0, 128));
    g.fill(new Rectangle(1, 2, 3, 4));
    Element p = only(parse(g.document()), "path");
    // Device corners: (10 + 2*1, 20 + 2*2) = (12, 24) to (12 + 6, 24 + 8) = (18, 32).
    assertEquals(new Rectangle2D.Double(12, 24, 6, 8), SvgRaster.path(p.getAttribute("d")).getBounds2D());
    assertEquals("#ff0000", p.getAttribute("fill"));
    // 128/255 = 0.502, written to three decimals.
    assertEquals(0.502, Double.parseDouble(p.getAttribute("fill-opacity")), 1e-9);
  }

  @Test
  void dashedStrokeScalesWithTheTransform() throws Exception {
    SvgGraphics g = new SvgGraphics(200, 100);
    g.scale(2, 2);
    g.setStroke(new BasicStroke(1.5f, BasicStroke.CAP_ROUND, BasicStroke.JOIN_BEVEL, 10f, new float[] {5f, 4f}, 1f));
    g.drawLine(0, 0, 50, 0);
    Element p = only(parse(g.document()), "path");
    assertEquals("none", p.getAttribute("fill"));
    assertEquals("3", p.getAttribute("stroke-width"));
    assertEquals("10,8", p.getAttribute("stroke-dasharray"));
    assertEquals("2", p.getAttribute("stroke-dashoffset"));
    assertEquals("round", p.getAttribute("stroke-linecap"));
    assertEquals("bevel", p.getAttribute("stroke-linejoin"));
  }

  @Test
  void elementHintsBecomeNestedGroupsAroundWhatIsDrawnBetweenThem() throws Exception {
    SvgGraphics g = new SvgGraphics(200, 100);
    g.setRenderingHint(ChartHints.KEY_BEGIN_ELEMENT, java.util.Map.of("class", "lane-group", "data-resource", "a&b"));
    g.fillRect(0, 0, 10, 10);
    g.setRenderingHint(ChartHints.KEY_BEGIN_ELEMENT, java.util.Map.of("ref", "{\"k\": 1}"));
    g.fillRect(20, 0, 10, 10);
    g.setRenderingHint(ChartHints.KEY_END_ELEMENT, Boolean.TRUE);
    g.setRenderingHint(ChartHints.KEY_END_ELEMENT, Boolean.TRUE);
    g.fillRect(40, 0, 10, 10); // outside every group
    g.setRenderingHint(ChartHints.KEY_BEGIN_ELEMENT, "left-open");
    g.fillRect(60, 0, 10, 10);
    Document d = parse(g.document());
    NodeList groups = d.getElementsByTagNameNS("http://www.w3.org/2000/svg", "g");
    assertEquals(3, groups.getLength());
    Element outer = (Element) groups.item(0);
    assertEquals("lane-group", outer.getAttribute("class"));
    assertEquals("a&b", outer.getAttribute("data-resource"));
    Element inner = (Element) groups.item(1);
    assertEquals(outer, inner.getParentNode(), "the second group is inside the first");
    assertEquals("{\"k\": 1}", inner.getAttribute("data-ref"), "a key of no SVG meaning gets data- before it");
    assertEquals(2, outer.getElementsByTagNameNS("http://www.w3.org/2000/svg", "path").getLength());
    assertEquals("left-open", ((Element) groups.item(2)).getAttribute("id"), "a string names the group");
    assertEquals("svg", ((Element) groups.item(2)).getParentNode().getLocalName(), "closed before the third");
    assertEquals(4, d.getElementsByTagNameNS("http://www.w3.org/2000/svg", "path").getLength());
    assertEquals(null, g.getRenderingHint(ChartHints.KEY_BEGIN_ELEMENT), "not kept as a hint");
  }

  @Test
  void shearedStrokeBecomesItsFilledOutline() throws Exception {
    SvgGraphics g = new SvgGraphics(200, 100);
    g.shear(0.5, 0);
    g.drawLine(0, 0, 50, 50);
    Element p = only(parse(g.document()), "path");
    assertFalse(p.hasAttribute("stroke"));
    assertEquals("#000000", p.getAttribute("fill"));
  }

  @Test
  void clipIsReferencedOnlyWhenItCutsTheElement() throws Exception {
    SvgGraphics g = new SvgGraphics(200, 100);
    g.clipRect(10, 10, 50, 50);
    g.fillRect(20, 20, 10, 10); // inside: no clip needed
    g.fillRect(0, 0, 100, 100); // cut by the clip
    Document d = parse(g.document());
    NodeList paths = d.getElementsByTagNameNS("*", "path");
    // defs hold the clip's own path, then the two drawn paths
    assertEquals(3, paths.getLength());
    Element clipPath = only(d, "clipPath");
    assertFalse(((Element) paths.item(1)).hasAttribute("clip-path"));
    assertEquals("url(#" + clipPath.getAttribute("id") + ")", ((Element) paths.item(2)).getAttribute("clip-path"));
    assertEquals(new Rectangle2D.Double(10, 10, 50, 50),
        SvgRaster.path(((Element) clipPath.getFirstChild()).getAttribute("d")).getBounds2D());
    assertEquals(new Rectangle(10, 10, 50, 50), g.getClipBounds());
  }

  @Test
  void rotatedTextKeepsItsTransformAndMeasuredLength() throws Exception {
    SvgGraphics g = new SvgGraphics(200, 200);
    Font f = new Font(Font.SANS_SERIF, Font.BOLD, 14);
    g.setFont(f);
    g.rotate(-Math.PI / 2, 100, 100);
    g.drawString("declination", 100, 100);
    Element t = only(parse(g.document()), "text");
    assertTrue(t.getAttribute("transform").startsWith("matrix(0 -1 1 0 "), t.getAttribute("transform"));
    assertEquals("bold", t.getAttribute("font-weight"));
    assertEquals("sans-serif", t.getAttribute("font-family"));
    double advance = f.getStringBounds("declination", g.getFontRenderContext()).getWidth();
    assertEquals(advance, Double.parseDouble(t.getAttribute("textLength")), 0.005);
  }

  @Test
  void gradientPaintBecomesALinearGradientDefinition() throws Exception {
    SvgGraphics g = new SvgGraphics(200, 100);
    g.setPaint(new GradientPaint(0, 0, Color.RED, 100, 0, Color.BLUE));
    g.fillRect(0, 0, 100, 100);
    Document d = parse(g.document());
    Element lg = only(d, "linearGradient");
    assertEquals("url(#" + lg.getAttribute("id") + ")", only(d, "path").getAttribute("fill"));
    assertEquals("100", lg.getAttribute("x2"));
  }

  @Test
  void otherPaintsAreRefusedRatherThanDrawnWrong() {
    SvgGraphics g = new SvgGraphics(200, 100);
    g.setPaint(new RadialGradientPaint(50, 50, 20, new float[] {0, 1}, new Color[] {Color.RED, Color.BLUE}));
    assertThrows(IllegalArgumentException.class, () -> g.fillRect(0, 0, 10, 10));
  }

  @Test
  void copiesDrawIntoTheSameDocument() throws Exception {
    SvgGraphics g = new SvgGraphics(200, 100);
    java.awt.Graphics2D copy = (java.awt.Graphics2D) g.create();
    copy.translate(50, 0);
    copy.fillRect(0, 0, 10, 10);
    copy.dispose();
    g.fillRect(0, 0, 10, 10);
    NodeList paths = parse(g.document()).getElementsByTagNameNS("*", "path");
    assertEquals(2, paths.getLength());
    assertEquals(50, SvgRaster.path(((Element) paths.item(0)).getAttribute("d")).getBounds2D().getX(), 0);
    assertEquals(0, SvgRaster.path(((Element) paths.item(1)).getAttribute("d")).getBounds2D().getX(), 0);
  }

  // ------------------------------------------------------------------ the charts themselves

  /**
   * The charts' SVG drawn by an independent reading of the SVG specification ({@link SvgRaster}) against
   * the PNG Java2D draws of the same chart object (JFreeChart's encoder); both rasterise with Java2D, so
   * this checks what the SVG says, not how a viewer draws it. A pixel "differs" when a colour channel
   * differs by more than a quarter of the range (64 of 255). Measured on the three bundled scenarios
   * (JDK 17, DejaVu fonts): at most 0.05 % of the pixels differ (a rotated axis label whose glyphs Java
   * places slightly differently); leaving out only the dark observation bars makes 0.49 % of the demo
   * timeline differ. The limit, 0.1 %, sits between the two.
   */
  @Test
  void everyChartSvgLooksLikeItsPng(@TempDir Path dir) throws Exception {
    String scenarios = "src/main/resources/scenarios/";
    plot(scenarios + "demo-night.json", dir.resolve("ground"));
    plot(scenarios + "leo-telescope-day.json", dir.resolve("orbit"));
    plot(scenarios + "satellite-tracking-night.json", dir.resolve("tracking"));
    for (String prefix : new String[] {"ground", "orbit", "tracking"}) {
      for (String chart : new String[] {"-timeline", "-sky"}) {
        BufferedImage png = ImageIO.read(dir.resolve(prefix + chart + ".png").toFile());
        BufferedImage svg = SvgRaster.render(Files.readString(dir.resolve(prefix + chart + ".svg")));
        assertEquals(png.getWidth(), svg.getWidth());
        assertEquals(png.getHeight(), svg.getHeight());
        double differing = differingFraction(png, svg);
        assertTrue(differing < 0.001, prefix + chart + ": " + 100 * differing + " % of the pixels differ");
      }
    }
  }

  private static void plot(String scenario, Path prefix) {
    StringWriter out = new StringWriter();
    int code = SequencerCli.execute(new PrintWriter(out), new PrintWriter(out), "plan", scenario, "--solver", "greedy",
        "--plot", prefix.toString(), "--plot-unscheduled");
    assertEquals(0, code, out.toString());
  }

  static double differingFraction(BufferedImage a, BufferedImage b) {
    long differing = 0;
    for (int y = 0; y < a.getHeight(); y++) {
      for (int x = 0; x < a.getWidth(); x++) {
        int p = a.getRGB(x, y);
        int q = b.getRGB(x, y);
        int d = 0;
        for (int shift = 0; shift <= 16; shift += 8) {
          d = Math.max(d, Math.abs(((p >> shift) & 0xff) - ((q >> shift) & 0xff)));
        }
        if (d > 64) {
          differing++;
        }
      }
    }
    return differing / (double) ((long) a.getWidth() * a.getHeight());
  }
}
