package dev.sequencer.charts;

import java.awt.AlphaComposite;
import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Composite;
import java.awt.Font;
import java.awt.FontMetrics;
import java.awt.GradientPaint;
import java.awt.Graphics;
import java.awt.Graphics2D;
import java.awt.GraphicsConfiguration;
import java.awt.Image;
import java.awt.Paint;
import java.awt.Rectangle;
import java.awt.RenderingHints;
import java.awt.Shape;
import java.awt.Stroke;
import java.awt.font.FontRenderContext;
import java.awt.font.GlyphVector;
import java.awt.font.TextLayout;
import java.awt.geom.AffineTransform;
import java.awt.geom.Arc2D;
import java.awt.geom.Area;
import java.awt.geom.Ellipse2D;
import java.awt.geom.Line2D;
import java.awt.geom.NoninvertibleTransformException;
import java.awt.geom.Path2D;
import java.awt.geom.PathIterator;
import java.awt.geom.Point2D;
import java.awt.geom.Rectangle2D;
import java.awt.geom.RoundRectangle2D;
import java.awt.image.BufferedImage;
import java.awt.image.BufferedImageOp;
import java.awt.image.ImageObserver;
import java.awt.image.RenderedImage;
import java.awt.image.renderable.RenderableImage;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.text.AttributedCharacterIterator;
import java.util.Base64;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;
import javax.imageio.ImageIO;
import org.jfree.chart.ChartHints;

/**
 * A {@link Graphics2D} that records what is drawn as an SVG 1.1 document instead of pixels, enough for
 * JFreeChart's charts: shapes filled and stroked (solid colours with transparency, {@link GradientPaint},
 * {@link BasicStroke} widths, caps, joins and dashes), clipping, transforms, text as {@code <text>} in the
 * generic font families, and images embedded as PNG.
 *
 * <p>Geometry is written in device pixels (the current transform applied), text with its transform
 * so that rotated labels stay text. Each text element carries the advance Java measured
 * ({@code textLength}), so a viewer with other fonts keeps the labels where the layout put them.
 * Unsupported, because an SVG cannot do them: XOR mode (drawn as paint mode), {@link #copyArea} (an
 * {@link UnsupportedOperationException}), paints other than {@link Color} and {@link GradientPaint}
 * (an {@link IllegalArgumentException} when drawn with). Composites other than {@link AlphaComposite}
 * are drawn as source-over. Groups: the element hints JFreeChart's renderers send ({@link ChartHints}) become
 * {@code <g>} elements around what is drawn between them. Not thread-safe; {@link #create()} copies share one
 * document.
 */
final class SvgGraphics extends Graphics2D {
  /** A 1 x 1 image whose graphics measure fonts and give the device configuration (works headless). */
  private static final BufferedImage SCRATCH = new BufferedImage(1, 1, BufferedImage.TYPE_INT_ARGB);

  private final SvgDocument doc;
  private final Graphics2D metrics;
  private AffineTransform transform = new AffineTransform();
  /** Clip in device space, or null for none. */
  private Shape clip;
  private Paint paint = Color.BLACK;
  private Color color = Color.BLACK;
  private Color background = Color.WHITE;
  private Stroke stroke = new BasicStroke(1f);
  private Font font = new Font(Font.SANS_SERIF, Font.PLAIN, 12);
  private Composite composite = AlphaComposite.SrcOver;
  private final RenderingHints hints = new RenderingHints(null);

  /** A blank {@code widthPx} x {@code heightPx} drawing. */
  SvgGraphics(int widthPx, int heightPx) {
    this(new SvgDocument(widthPx, heightPx));
  }

  private SvgGraphics(SvgDocument doc) {
    this.doc = doc;
    this.metrics = SCRATCH.createGraphics();
  }

  /** The SVG document of everything drawn so far, by this object and its copies. */
  String document() {
    return doc.text();
  }

  @Override
  public Graphics create() {
    SvgGraphics g = new SvgGraphics(doc);
    g.transform = new AffineTransform(transform);
    g.clip = clip;
    g.paint = paint;
    g.color = color;
    g.background = background;
    g.stroke = stroke;
    g.font = font;
    g.composite = composite;
    g.hints.putAll(hints);
    g.metrics.setRenderingHints(hints);
    return g;
  }

  @Override
  public void dispose() {
    metrics.dispose();
  }

  // ------------------------------------------------------------------ drawing shapes

  @Override
  public void draw(Shape s) {
    if (stroke instanceof BasicStroke bs && !hasShear(transform)) {
      String d = SvgDocument.pathData(s, transform);
      if (d.isEmpty()) {
        return;
      }
      double scale = Math.sqrt(Math.abs(transform.getDeterminant()));
      StringBuilder sb = new StringBuilder(d.length() + 160);
      sb.append("<path d=\"").append(d).append("\" fill=\"none\"");
      paintAttributes(sb, "stroke");
      double width = bs.getLineWidth() * scale;
      // Java draws a zero-width stroke as the thinnest visible line; SVG would draw nothing.
      sb.append(" stroke-width=\"").append(SvgDocument.number(width == 0 ? 1 : width)).append('"');
      if (bs.getEndCap() != BasicStroke.CAP_BUTT) {
        sb.append(" stroke-linecap=\"").append(bs.getEndCap() == BasicStroke.CAP_ROUND ? "round" : "square").append('"');
      }
      if (bs.getLineJoin() != BasicStroke.JOIN_MITER) {
        sb.append(" stroke-linejoin=\"").append(bs.getLineJoin() == BasicStroke.JOIN_ROUND ? "round" : "bevel").append('"');
      } else if (bs.getMiterLimit() != 4f) {
        sb.append(" stroke-miterlimit=\"").append(SvgDocument.number(Math.max(1, bs.getMiterLimit()))).append('"');
      }
      float[] dash = bs.getDashArray();
      if (dash != null && dash.length > 0) {
        sb.append(" stroke-dasharray=\"");
        for (int i = 0; i < dash.length; i++) {
          sb.append(i == 0 ? "" : ",").append(SvgDocument.number(dash[i] * scale));
        }
        sb.append('"');
        if (bs.getDashPhase() != 0) {
          sb.append(" stroke-dashoffset=\"").append(SvgDocument.number(bs.getDashPhase() * scale)).append('"');
        }
      }
      clipAttribute(sb, strokeBounds(s, bs));
      doc.element(sb.append("/>").toString());
    } else {
      // Any other stroke (or a sheared transform): draw the outline the stroke itself computes.
      fill(stroke.createStrokedShape(s));
    }
  }

  @Override
  public void fill(Shape s) {
    String d = SvgDocument.pathData(s, transform);
    if (d.isEmpty()) {
      return;
    }
    Rectangle2D bounds = transform.createTransformedShape(s).getBounds2D();
    StringBuilder sb = new StringBuilder(d.length() + 120);
    sb.append("<path d=\"").append(d).append('"');
    paintAttributes(sb, "fill");
    if (s.getPathIterator(null).getWindingRule() == PathIterator.WIND_EVEN_ODD) {
      sb.append(" fill-rule=\"evenodd\"");
    }
    clipAttribute(sb, bounds);
    doc.element(sb.append("/>").toString());
  }

  /** Device-space bounds of {@code s} drawn with {@code bs}, for the clip test. */
  private Rectangle2D strokeBounds(Shape s, BasicStroke bs) {
    Rectangle2D b = transform.createTransformedShape(s).getBounds2D();
    double grow = bs.getLineWidth() * Math.sqrt(Math.abs(transform.getDeterminant())) * Math.max(1, bs.getMiterLimit());
    return new Rectangle2D.Double(b.getX() - grow, b.getY() - grow, b.getWidth() + 2 * grow, b.getHeight() + 2 * grow);
  }

  private static boolean hasShear(AffineTransform at) {
    // Rotation is fine (a uniform scale keeps stroke widths and dashes); a non-uniform scale or shear is not.
    double sx = Math.hypot(at.getScaleX(), at.getShearY());
    double sy = Math.hypot(at.getShearX(), at.getScaleY());
    double dot = at.getScaleX() * at.getShearX() + at.getShearY() * at.getScaleY();
    return Math.abs(sx - sy) > 1e-9 * Math.max(1, sx) || Math.abs(dot) > 1e-9 * Math.max(1, sx * sy);
  }

  /** Appends {@code kind="..."} (fill or stroke) and its opacity for the current paint and composite. */
  private void paintAttributes(StringBuilder sb, String kind) {
    double alpha = compositeAlpha();
    if (paint instanceof Color c) {
      sb.append(' ').append(kind).append("=\"").append(rgb(c)).append('"');
      alpha *= c.getAlpha() / 255.0;
    } else if (paint instanceof GradientPaint gp) {
      sb.append(' ').append(kind).append("=\"url(#").append(doc.gradientId(gradient(gp))).append(")\"");
    } else {
      throw new IllegalArgumentException("SvgGraphics cannot draw with a " + paint.getClass().getName()
          + " (only Color and GradientPaint)");
    }
    if (alpha < 1) {
      sb.append(' ').append(kind).append("-opacity=\"").append(String.format(Locale.ROOT, "%.3f", alpha)).append('"');
    }
  }

  private double compositeAlpha() {
    return composite instanceof AlphaComposite ac ? ac.getAlpha() : 1.0;
  }

  /** A linear gradient definition (with "ID" for its id) between the paint's two points, in device space. */
  private String gradient(GradientPaint gp) {
    Point2D p1 = transform.transform(gp.getPoint1(), null);
    Point2D p2 = transform.transform(gp.getPoint2(), null);
    return "<linearGradient id=\"ID\" gradientUnits=\"userSpaceOnUse\" x1=\"" + SvgDocument.number(p1.getX())
        + "\" y1=\"" + SvgDocument.number(p1.getY()) + "\" x2=\"" + SvgDocument.number(p2.getX()) + "\" y2=\""
        + SvgDocument.number(p2.getY()) + "\"" + (gp.isCyclic() ? " spreadMethod=\"reflect\"" : "") + ">"
        + stop(0, gp.getColor1()) + stop(1, gp.getColor2()) + "</linearGradient>";
  }

  private static String stop(int offset, Color c) {
    return "<stop offset=\"" + offset + "\" stop-color=\"" + rgb(c) + "\""
        + (c.getAlpha() < 255 ? String.format(Locale.ROOT, " stop-opacity=\"%.3f\"", c.getAlpha() / 255.0) : "") + "/>";
  }

  private static String rgb(Color c) {
    return String.format(Locale.ROOT, "#%02x%02x%02x", c.getRed(), c.getGreen(), c.getBlue());
  }

  /** Appends the clip reference, unless the element lies wholly inside a rectangular clip. */
  private void clipAttribute(StringBuilder sb, Rectangle2D deviceBounds) {
    if (clip == null || clip instanceof Rectangle2D r && r.contains(deviceBounds)) {
      return;
    }
    sb.append(" clip-path=\"url(#").append(doc.clipId(SvgDocument.pathData(clip, null))).append(")\"");
  }

  // ------------------------------------------------------------------ text

  @Override
  public void drawString(String str, int x, int y) {
    drawString(str, (float) x, (float) y);
  }

  @Override
  public void drawString(String str, float x, float y) {
    if (str == null || str.isEmpty()) {
      return;
    }
    AffineTransform at = new AffineTransform(transform);
    AffineTransform fontTransform = font.getTransform();
    Font f = font;
    if (!fontTransform.isIdentity()) {
      // A transformed font (e.g. JFreeChart's rotated labels): fold its transform into the element's.
      at.translate(x, y);
      at.concatenate(fontTransform);
      at.translate(-x, -y);
      f = font.deriveFont(new AffineTransform());
    }
    Rectangle2D advance = f.getStringBounds(str, getFontRenderContext());
    StringBuilder sb = new StringBuilder(str.length() + 200);
    sb.append("<text");
    if (at.getType() == AffineTransform.TYPE_IDENTITY || at.getType() == AffineTransform.TYPE_TRANSLATION) {
      sb.append(" x=\"").append(SvgDocument.number(x + at.getTranslateX())).append("\" y=\"")
          .append(SvgDocument.number(y + at.getTranslateY())).append('"');
    } else {
      sb.append(" x=\"").append(SvgDocument.number(x)).append("\" y=\"").append(SvgDocument.number(y)).append('"')
          .append(" transform=\"matrix(").append(SvgDocument.number(at.getScaleX())).append(' ')
          .append(SvgDocument.number(at.getShearY())).append(' ').append(SvgDocument.number(at.getShearX()))
          .append(' ').append(SvgDocument.number(at.getScaleY())).append(' ')
          .append(SvgDocument.number(at.getTranslateX())).append(' ').append(SvgDocument.number(at.getTranslateY()))
          .append(")\"");
    }
    sb.append(" font-family=\"").append(family(f)).append("\" font-size=\"").append(SvgDocument.number(f.getSize2D()))
        .append('"');
    if (f.isBold()) {
      sb.append(" font-weight=\"bold\"");
    }
    if (f.isItalic()) {
      sb.append(" font-style=\"italic\"");
    }
    sb.append(" textLength=\"").append(SvgDocument.number(advance.getWidth()))
        .append("\" lengthAdjust=\"spacingAndGlyphs\"");
    Rectangle2D bounds = at.createTransformedShape(new Rectangle2D.Double(x + advance.getX(), y + advance.getY(),
        advance.getWidth(), advance.getHeight())).getBounds2D();
    paintAttributes(sb, "fill");
    clipAttribute(sb, bounds);
    sb.append('>').append(SvgDocument.escape(str)).append("</text>");
    doc.element(sb.toString());
  }

  /** The CSS font family list for {@code f}: Java's logical fonts map to the generic families. */
  private static String family(Font f) {
    String name = f.getFamily(Locale.ROOT);
    String generic = switch (f.getName()) {
      case Font.SERIF -> "serif";
      case Font.MONOSPACED, Font.DIALOG_INPUT -> "monospace";
      case Font.SANS_SERIF, Font.DIALOG -> "sans-serif";
      default -> null;
    };
    return generic != null ? generic : "'" + SvgDocument.escape(name).replace("'", "") + "', sans-serif";
  }

  @Override
  public void drawString(AttributedCharacterIterator iterator, int x, int y) {
    drawString(iterator, (float) x, (float) y);
  }

  @Override
  public void drawString(AttributedCharacterIterator iterator, float x, float y) {
    // Styled runs (superscripts, mixed fonts) are drawn as outlines: exact, though no longer text.
    if (iterator.getEndIndex() > iterator.getBeginIndex()) {
      fill(new TextLayout(iterator, getFontRenderContext()).getOutline(AffineTransform.getTranslateInstance(x, y)));
    }
  }

  @Override
  public void drawGlyphVector(GlyphVector g, float x, float y) {
    fill(g.getOutline(x, y));
  }

  @Override
  public FontRenderContext getFontRenderContext() {
    Object aa = hints.get(RenderingHints.KEY_TEXT_ANTIALIASING);
    Object fm = hints.get(RenderingHints.KEY_FRACTIONALMETRICS);
    return new FontRenderContext(null, aa == null ? RenderingHints.VALUE_TEXT_ANTIALIAS_DEFAULT : aa,
        fm == null ? RenderingHints.VALUE_FRACTIONALMETRICS_DEFAULT : fm);
  }

  @Override
  public FontMetrics getFontMetrics(Font f) {
    return metrics.getFontMetrics(f);
  }

  @Override
  public Font getFont() {
    return font;
  }

  @Override
  public void setFont(Font f) {
    if (f != null) {
      font = f;
    }
  }

  // ------------------------------------------------------------------ images

  @Override
  public boolean drawImage(Image img, AffineTransform xform, ImageObserver obs) {
    BufferedImage bi = buffered(img);
    if (bi == null) {
      return false;
    }
    AffineTransform at = new AffineTransform(transform);
    if (xform != null) {
      at.concatenate(xform);
    }
    ByteArrayOutputStream png = new ByteArrayOutputStream();
    try {
      ImageIO.write(bi, "png", png);
    } catch (IOException e) {
      throw new UncheckedIOException("cannot encode an image for the SVG", e);
    }
    Rectangle2D bounds = at.createTransformedShape(new Rectangle(0, 0, bi.getWidth(), bi.getHeight())).getBounds2D();
    StringBuilder sb = new StringBuilder(png.size() * 4 / 3 + 200);
    sb.append("<image width=\"").append(bi.getWidth()).append("\" height=\"").append(bi.getHeight())
        .append("\" preserveAspectRatio=\"none\" transform=\"matrix(").append(SvgDocument.number(at.getScaleX()))
        .append(' ').append(SvgDocument.number(at.getShearY())).append(' ').append(SvgDocument.number(at.getShearX()))
        .append(' ').append(SvgDocument.number(at.getScaleY())).append(' ').append(SvgDocument.number(at.getTranslateX()))
        .append(' ').append(SvgDocument.number(at.getTranslateY())).append(")\"");
    double alpha = compositeAlpha();
    if (alpha < 1) {
      sb.append(String.format(Locale.ROOT, " opacity=\"%.3f\"", alpha));
    }
    clipAttribute(sb, bounds);
    sb.append(" xlink:href=\"data:image/png;base64,").append(Base64.getEncoder().encodeToString(png.toByteArray()))
        .append("\"/>");
    doc.element(sb.toString());
    return true;
  }

  /** {@code img} as a BufferedImage, or null when its size is not known yet (an image still loading). */
  private static BufferedImage buffered(Image img) {
    if (img instanceof BufferedImage bi) {
      return bi;
    }
    if (img == null || img.getWidth(null) <= 0 || img.getHeight(null) <= 0) {
      return null;
    }
    BufferedImage bi = new BufferedImage(img.getWidth(null), img.getHeight(null), BufferedImage.TYPE_INT_ARGB);
    Graphics2D g = bi.createGraphics();
    g.drawImage(img, 0, 0, null);
    g.dispose();
    return bi;
  }

  @Override
  public void drawImage(BufferedImage img, BufferedImageOp op, int x, int y) {
    drawImage(op == null ? img : op.filter(img, null), AffineTransform.getTranslateInstance(x, y), null);
  }

  @Override
  public void drawRenderedImage(RenderedImage img, AffineTransform xform) {
    BufferedImage bi;
    if (img instanceof BufferedImage b) {
      bi = b;
    } else {
      bi = new BufferedImage(img.getColorModel(), img.copyData(null), img.getColorModel().isAlphaPremultiplied(), null);
    }
    drawImage(bi, xform, null);
  }

  @Override
  public void drawRenderableImage(RenderableImage img, AffineTransform xform) {
    drawRenderedImage(img.createDefaultRendering(), xform);
  }

  @Override
  public boolean drawImage(Image img, int x, int y, ImageObserver observer) {
    return drawImage(img, AffineTransform.getTranslateInstance(x, y), observer);
  }

  @Override
  public boolean drawImage(Image img, int x, int y, int width, int height, ImageObserver observer) {
    BufferedImage bi = buffered(img);
    if (bi == null) {
      return false;
    }
    AffineTransform at = AffineTransform.getTranslateInstance(x, y);
    at.scale(width / (double) bi.getWidth(), height / (double) bi.getHeight());
    return drawImage(bi, at, observer);
  }

  @Override
  public boolean drawImage(Image img, int x, int y, Color bgcolor, ImageObserver observer) {
    BufferedImage bi = buffered(img);
    return bi != null && drawImage(img, x, y, bi.getWidth(), bi.getHeight(), bgcolor, observer);
  }

  @Override
  public boolean drawImage(Image img, int x, int y, int width, int height, Color bgcolor, ImageObserver observer) {
    if (bgcolor != null) {
      Paint saved = paint;
      setPaint(bgcolor);
      fill(new Rectangle(x, y, width, height));
      setPaint(saved);
    }
    return drawImage(img, x, y, width, height, observer);
  }

  @Override
  public boolean drawImage(Image img, int dx1, int dy1, int dx2, int dy2, int sx1, int sy1, int sx2, int sy2,
      ImageObserver observer) {
    BufferedImage bi = buffered(img);
    if (bi == null) {
      return false;
    }
    int sx = Math.min(sx1, sx2);
    int sy = Math.min(sy1, sy2);
    int sw = Math.abs(sx2 - sx1);
    int sh = Math.abs(sy2 - sy1);
    if (sw == 0 || sh == 0) {
      return true;
    }
    BufferedImage part = bi.getSubimage(sx, sy, sw, sh);
    AffineTransform at = AffineTransform.getTranslateInstance(dx1, dy1);
    at.scale((dx2 - dx1) / (double) (sx2 - sx1), (dy2 - dy1) / (double) (sy2 - sy1));
    if (sx2 < sx1) {
      at.translate(-sw, 0);
    }
    if (sy2 < sy1) {
      at.translate(0, -sh);
    }
    return drawImage(part, at, observer);
  }

  @Override
  public boolean drawImage(Image img, int dx1, int dy1, int dx2, int dy2, int sx1, int sy1, int sx2, int sy2,
      Color bgcolor, ImageObserver observer) {
    if (bgcolor != null) {
      Paint saved = paint;
      setPaint(bgcolor);
      fill(new Rectangle(Math.min(dx1, dx2), Math.min(dy1, dy2), Math.abs(dx2 - dx1), Math.abs(dy2 - dy1)));
      setPaint(saved);
    }
    return drawImage(img, dx1, dy1, dx2, dy2, sx1, sy1, sx2, sy2, observer);
  }

  // ------------------------------------------------------------------ the primitives of Graphics

  @Override
  public void drawLine(int x1, int y1, int x2, int y2) {
    draw(new Line2D.Double(x1, y1, x2, y2));
  }

  @Override
  public void drawRect(int x, int y, int width, int height) {
    if (width >= 0 && height >= 0) {
      draw(new Rectangle(x, y, width, height));
    }
  }

  @Override
  public void fillRect(int x, int y, int width, int height) {
    fill(new Rectangle(x, y, width, height));
  }

  @Override
  public void clearRect(int x, int y, int width, int height) {
    Paint saved = paint;
    Composite savedComposite = composite;
    paint = background;
    composite = AlphaComposite.Src;
    fill(new Rectangle(x, y, width, height));
    paint = saved;
    composite = savedComposite;
  }

  @Override
  public void drawRoundRect(int x, int y, int width, int height, int arcWidth, int arcHeight) {
    draw(new RoundRectangle2D.Double(x, y, width, height, arcWidth, arcHeight));
  }

  @Override
  public void fillRoundRect(int x, int y, int width, int height, int arcWidth, int arcHeight) {
    fill(new RoundRectangle2D.Double(x, y, width, height, arcWidth, arcHeight));
  }

  @Override
  public void drawOval(int x, int y, int width, int height) {
    draw(new Ellipse2D.Double(x, y, width, height));
  }

  @Override
  public void fillOval(int x, int y, int width, int height) {
    fill(new Ellipse2D.Double(x, y, width, height));
  }

  @Override
  public void drawArc(int x, int y, int width, int height, int startAngle, int arcAngle) {
    draw(new Arc2D.Double(x, y, width, height, startAngle, arcAngle, Arc2D.OPEN));
  }

  @Override
  public void fillArc(int x, int y, int width, int height, int startAngle, int arcAngle) {
    fill(new Arc2D.Double(x, y, width, height, startAngle, arcAngle, Arc2D.PIE));
  }

  @Override
  public void drawPolyline(int[] xPoints, int[] yPoints, int nPoints) {
    if (nPoints > 1) {
      draw(polygon(xPoints, yPoints, nPoints, false));
    }
  }

  @Override
  public void drawPolygon(int[] xPoints, int[] yPoints, int nPoints) {
    if (nPoints > 1) {
      draw(polygon(xPoints, yPoints, nPoints, true));
    }
  }

  @Override
  public void fillPolygon(int[] xPoints, int[] yPoints, int nPoints) {
    if (nPoints > 2) {
      fill(polygon(xPoints, yPoints, nPoints, true));
    }
  }

  private static Path2D polygon(int[] xs, int[] ys, int n, boolean close) {
    Path2D.Double p = new Path2D.Double(Path2D.WIND_EVEN_ODD, n);
    p.moveTo(xs[0], ys[0]);
    for (int i = 1; i < n; i++) {
      p.lineTo(xs[i], ys[i]);
    }
    if (close) {
      p.closePath();
    }
    return p;
  }

  @Override
  public void copyArea(int x, int y, int width, int height, int dx, int dy) {
    throw new UnsupportedOperationException("an SVG drawing cannot copy its own pixels");
  }

  @Override
  public boolean hit(Rectangle rect, Shape s, boolean onStroke) {
    Shape device = transform.createTransformedShape(onStroke ? stroke.createStrokedShape(s) : s);
    return device.intersects(rect);
  }

  // ------------------------------------------------------------------ clip

  @Override
  public Shape getClip() {
    if (clip == null) {
      return null;
    }
    try {
      return transform.createInverse().createTransformedShape(clip);
    } catch (NoninvertibleTransformException e) {
      return null;
    }
  }

  @Override
  public Rectangle getClipBounds() {
    Shape c = getClip();
    return c == null ? null : c.getBounds();
  }

  @Override
  public void setClip(Shape userClip) {
    clip = userClip == null ? null : device(userClip);
  }

  @Override
  public void setClip(int x, int y, int width, int height) {
    setClip(new Rectangle(x, y, width, height));
  }

  @Override
  public void clipRect(int x, int y, int width, int height) {
    clip(new Rectangle(x, y, width, height));
  }

  @Override
  public void clip(Shape s) {
    Shape add = device(s);
    if (clip == null) {
      clip = add;
    } else if (clip instanceof Rectangle2D a && add instanceof Rectangle2D b) {
      Rectangle2D r = new Rectangle2D.Double();
      Rectangle2D.intersect(a, b, r);
      clip = r.isEmpty() ? new Rectangle2D.Double(r.getX(), r.getY(), 0, 0) : r;
    } else {
      Area area = new Area(clip);
      area.intersect(new Area(add));
      clip = area;
    }
  }

  /** {@code s} in device space; an axis-aligned rectangle stays a rectangle (cheaper clip tests). */
  private Shape device(Shape s) {
    if (s instanceof Rectangle2D r && (transform.getType() & ~(AffineTransform.TYPE_TRANSLATION
        | AffineTransform.TYPE_UNIFORM_SCALE | AffineTransform.TYPE_GENERAL_SCALE)) == 0) {
      return transform.createTransformedShape(r).getBounds2D();
    }
    return transform.createTransformedShape(s);
  }

  // ------------------------------------------------------------------ transform

  @Override
  public void translate(int x, int y) {
    transform.translate(x, y);
  }

  @Override
  public void translate(double tx, double ty) {
    transform.translate(tx, ty);
  }

  @Override
  public void rotate(double theta) {
    transform.rotate(theta);
  }

  @Override
  public void rotate(double theta, double x, double y) {
    transform.rotate(theta, x, y);
  }

  @Override
  public void scale(double sx, double sy) {
    transform.scale(sx, sy);
  }

  @Override
  public void shear(double shx, double shy) {
    transform.shear(shx, shy);
  }

  @Override
  public void transform(AffineTransform tx) {
    transform.concatenate(tx);
  }

  @Override
  public void setTransform(AffineTransform tx) {
    transform = new AffineTransform(tx);
  }

  @Override
  public AffineTransform getTransform() {
    return new AffineTransform(transform);
  }

  // ------------------------------------------------------------------ paint, stroke, composite, hints

  @Override
  public Paint getPaint() {
    return paint;
  }

  @Override
  public void setPaint(Paint p) {
    if (p != null) {
      paint = p;
      if (p instanceof Color c) {
        color = c;
      }
    }
  }

  @Override
  public Color getColor() {
    return color;
  }

  @Override
  public void setColor(Color c) {
    setPaint(c);
  }

  @Override
  public void setPaintMode() {
    // paint mode is the only mode
  }

  @Override
  public void setXORMode(Color c1) {
    // SVG has no XOR: drawing continues in paint mode (see the class comment)
  }

  @Override
  public Color getBackground() {
    return background;
  }

  @Override
  public void setBackground(Color c) {
    if (c != null) {
      background = c;
    }
  }

  @Override
  public Stroke getStroke() {
    return stroke;
  }

  @Override
  public void setStroke(Stroke s) {
    if (s != null) {
      stroke = s;
    }
  }

  @Override
  public Composite getComposite() {
    return composite;
  }

  @Override
  public void setComposite(Composite comp) {
    if (comp != null) {
      composite = comp;
    }
  }

  /**
   * Besides the usual hints: JFreeChart's {@link ChartHints#KEY_BEGIN_ELEMENT} opens an SVG group and
   * {@link ChartHints#KEY_END_ELEMENT} closes it (see {@link #groupAttributes}); neither is kept as a hint.
   */
  @Override
  public void setRenderingHint(RenderingHints.Key hintKey, Object hintValue) {
    if (hintKey == ChartHints.KEY_BEGIN_ELEMENT) {
      doc.beginGroup(groupAttributes(hintValue));
      return;
    }
    if (hintKey == ChartHints.KEY_END_ELEMENT) {
      doc.endGroup();
      return;
    }
    hints.put(hintKey, hintValue);
    metrics.setRenderingHint(hintKey, hintValue);
  }

  /**
   * The attributes of the group a {@link ChartHints#KEY_BEGIN_ELEMENT} value asks for: a string is the
   * group's {@code id}; in a map, {@code id}, {@code class} and {@code data-*} keep their names and any other
   * key gets {@code data-} before it (JFreeChart's {@code ref} becomes {@code data-ref}). Sorted by name, so
   * the document does not depend on the map's order.
   */
  static Map<String, String> groupAttributes(Object hintValue) {
    Map<String, String> out = new TreeMap<>();
    if (hintValue instanceof String id) {
      out.put("id", id);
    } else if (hintValue instanceof Map<?, ?> m) {
      m.forEach((k, v) -> {
        String name = String.valueOf(k);
        out.put(name.equals("id") || name.equals("class") || name.startsWith("data-") ? name : "data-" + name,
            v == null ? "" : v.toString());
      });
    }
    return out;
  }

  @Override
  public Object getRenderingHint(RenderingHints.Key hintKey) {
    return hints.get(hintKey);
  }

  @Override
  public void setRenderingHints(Map<?, ?> newHints) {
    hints.clear();
    addRenderingHints(newHints);
  }

  @Override
  public void addRenderingHints(Map<?, ?> newHints) {
    newHints.forEach((k, v) -> {
      if (k instanceof RenderingHints.Key key) {
        setRenderingHint(key, v);
      }
    });
  }

  @Override
  public RenderingHints getRenderingHints() {
    return (RenderingHints) hints.clone();
  }

  @Override
  public GraphicsConfiguration getDeviceConfiguration() {
    return metrics.getDeviceConfiguration();
  }
}
