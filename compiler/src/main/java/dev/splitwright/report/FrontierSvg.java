package dev.splitwright.report;

import dev.splitwright.text.DecimalText;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Objects;

/**
 * Draws the budget search's trade-off as a plain SVG chart: validation score against measured
 * size, every candidate as a grey dot, the Pareto frontier as a blue staircase, the budget as a
 * dashed red line with the sizes past it shaded, and the chosen classifier as a green ring
 * labelled with its size, score and leaves. Each kind of classifier has its own marker (a tree a
 * circle, a forest a triangle, a boosted ensemble a square), named in the legend when more than one
 * kind is drawn. Both axes are zoomed to the data and the budget, with
 * round, labelled ticks. Numbers are formatted with {@link Locale#ROOT} and nothing depends on
 * time or platform, so equal inputs give equal bytes.
 */
public final class FrontierSvg {
  private static final int WIDTH = 760;
  private static final int HEIGHT = 480;
  private static final int LEFT = 78;
  private static final int RIGHT = 24;
  private static final int TOP = 64;
  private static final int BOTTOM = 84;

  private final Chart chart;
  private final Scale x;
  private final Scale y;
  private final StringBuilder out = new StringBuilder();

  /**
   * A point: size in bytes, score in [0, 1] and the kind of classifier ({@code tree}, {@code
   * forest} or {@code boosted}), which picks its marker.
   */
  public record Dot(int size, double score, String kind) {

    public Dot {
      if (!KINDS.contains(kind)) {
        throw new IllegalArgumentException("kind must be one of " + KINDS + ": " + kind);
      }
    }

    /** A single tree's point. */
    public Dot(int size, double score) {
      this(size, score, "tree");
    }
  }

  /** The kinds of classifier with a marker, in legend order. */
  static final List<String> KINDS = List.of("tree", "forest", "boosted");

  /**
   * What to draw.
   *
   * @param title the heading, e.g. the data set's name
   * @param subtitle the line under it, e.g. what is plotted against what
   * @param xLabel the size axis label with its unit, e.g. {@code class file size (bytes)}
   * @param yLabel the score axis label
   * @param budget the budget in the same bytes as the sizes
   * @param candidates every measured candidate
   * @param frontier the Pareto-optimal candidates, by size ascending
   * @param chosen the candidate emitted
   * @param chosenLeaves the leaves of the chosen candidate, all its trees together
   * @param chosenTrees its trees, 1 for a single tree
   */
  public record Chart(String title, String subtitle, String xLabel, String yLabel, int budget,
      List<Dot> candidates, List<Dot> frontier, Dot chosen, int chosenLeaves, int chosenTrees) {

    public Chart {
      Objects.requireNonNull(title, "title");
      Objects.requireNonNull(subtitle, "subtitle");
      Objects.requireNonNull(xLabel, "xLabel");
      Objects.requireNonNull(yLabel, "yLabel");
      candidates = List.copyOf(candidates);
      frontier = List.copyOf(frontier);
      Objects.requireNonNull(chosen, "chosen");
      if (frontier.isEmpty()) {
        throw new IllegalArgumentException("frontier is empty");
      }
      if (chosenLeaves < chosenTrees || chosenTrees < 1) {
        throw new IllegalArgumentException("each tree has at least one leaf: " + chosenTrees
            + " trees, " + chosenLeaves + " leaves");
      }
    }

    /** A chart whose chosen classifier is a single tree. */
    public Chart(String title, String subtitle, String xLabel, String yLabel, int budget,
        List<Dot> candidates, List<Dot> frontier, Dot chosen, int chosenLeaves) {
      this(title, subtitle, xLabel, yLabel, budget, candidates, frontier, chosen, chosenLeaves,
          1);
    }
  }

  private FrontierSvg(Chart chart) {
    this.chart = chart;
    // Both axes span every candidate and the budget, and no more: zero is left out when the data
    // is far from it, since the detail is in between.
    double smallest = chart.budget();
    double largest = chart.budget();
    double low = chart.chosen().score();
    double high = low;
    for (Dot d : points(chart)) {
      smallest = Math.min(smallest, d.size());
      largest = Math.max(largest, d.size());
      low = Math.min(low, d.score());
      high = Math.max(high, d.score());
    }
    double margin = (largest - smallest) * 0.03 + 1;
    this.x = Scale.of(Math.max(0, smallest - margin), largest + margin, LEFT, WIDTH - RIGHT);
    double pad = Math.max(0.005, (high - low) * 0.04);
    this.y = Scale.of(Math.max(0, low - pad), Math.min(1, high + pad), HEIGHT - BOTTOM, TOP);
  }

  private static List<Dot> points(Chart chart) {
    List<Dot> all = new ArrayList<>(chart.candidates());
    all.addAll(chart.frontier());
    all.add(chart.chosen());
    return all;
  }

  /** Renders {@code chart} as an SVG document ending in a newline. */
  public static String render(Chart chart) {
    return new FrontierSvg(Objects.requireNonNull(chart, "chart")).draw();
  }

  private String draw() {
    line("<?xml version=\"1.0\" encoding=\"UTF-8\"?>");
    line("<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"%d\" height=\"%d\""
        + " viewBox=\"0 0 %d %d\" font-family=\"sans-serif\" font-size=\"12\">", WIDTH, HEIGHT,
        WIDTH, HEIGHT);
    line("  <title>%s: %s</title>", escape(chart.title()), escape(chart.subtitle()));
    line("  <rect width=\"%d\" height=\"%d\" fill=\"#ffffff\"/>", WIDTH, HEIGHT);
    line("  <text x=\"%d\" y=\"22\" font-size=\"15\" font-weight=\"bold\">%s</text>", LEFT,
        escape(shorten(chart.title())));
    line("  <text x=\"%d\" y=\"40\" fill=\"#555555\">%s</text>", LEFT,
        escape(shorten(chart.subtitle())));
    overBudget();
    axes();
    candidates();
    frontier();
    budget();
    chosen();
    legend();
    line("</svg>");
    return out.toString();
  }

  private void axes() {
    line("  <g stroke=\"#e4e4e4\" stroke-width=\"1\">");
    for (double t : x.ticks()) {
      line("    <line x1=\"%s\" y1=\"%d\" x2=\"%s\" y2=\"%d\"/>", num(x.map(t)), TOP, num(x.map(t)),
          HEIGHT - BOTTOM);
    }
    for (double t : y.ticks()) {
      line("    <line x1=\"%d\" y1=\"%s\" x2=\"%d\" y2=\"%s\"/>", LEFT, num(y.map(t)),
          WIDTH - RIGHT, num(y.map(t)));
    }
    line("  </g>");
    line("  <g stroke=\"#333333\" stroke-width=\"1\">");
    line("    <line x1=\"%d\" y1=\"%d\" x2=\"%d\" y2=\"%d\"/>", LEFT, HEIGHT - BOTTOM,
        WIDTH - RIGHT, HEIGHT - BOTTOM);
    line("    <line x1=\"%d\" y1=\"%d\" x2=\"%d\" y2=\"%d\"/>", LEFT, TOP, LEFT, HEIGHT - BOTTOM);
    for (double t : x.ticks()) {
      line("    <line x1=\"%s\" y1=\"%d\" x2=\"%s\" y2=\"%d\"/>", num(x.map(t)), HEIGHT - BOTTOM,
          num(x.map(t)), HEIGHT - BOTTOM + 5);
    }
    for (double t : y.ticks()) {
      line("    <line x1=\"%d\" y1=\"%s\" x2=\"%d\" y2=\"%s\"/>", LEFT - 5, num(y.map(t)), LEFT,
          num(y.map(t)));
    }
    line("  </g>");
    line("  <g fill=\"#333333\">");
    for (double t : x.ticks()) {
      line("    <text x=\"%s\" y=\"%d\" text-anchor=\"middle\">%s</text>", num(x.map(t)),
          HEIGHT - BOTTOM + 19, x.label(t));
    }
    for (double t : y.ticks()) {
      line("    <text x=\"%d\" y=\"%s\" text-anchor=\"end\">%s</text>", LEFT - 8,
          num(y.map(t) + 4), y.label(t));
    }
    line("    <text x=\"%s\" y=\"%d\" text-anchor=\"middle\">%s</text>",
        num((LEFT + WIDTH - RIGHT) / 2.0), HEIGHT - BOTTOM + 40, escape(chart.xLabel()));
    line("    <text transform=\"translate(20 %s) rotate(-90)\" text-anchor=\"middle\">%s</text>",
        num((TOP + HEIGHT - BOTTOM) / 2.0), escape(chart.yLabel()));
    line("  </g>");
  }

  private void candidates() {
    line("  <g fill=\"#9a9a9a\" fill-opacity=\"0.6\">");
    for (Dot d : chart.candidates()) {
      marker(d.kind(), x.map(d.size()), y.map(d.score()), 2.2);
    }
    line("  </g>");
  }

  private void frontier() {
    List<Dot> f = chart.frontier();
    StringBuilder path = new StringBuilder();
    path.append("M").append(num(x.map(f.get(0).size()))).append(' ')
        .append(num(y.map(f.get(0).score())));
    for (int i = 1; i < f.size(); i++) {
      path.append(" H").append(num(x.map(f.get(i).size())))
          .append(" V").append(num(y.map(f.get(i).score())));
    }
    path.append(" H").append(num(x.map(x.max)));
    line("  <path d=\"%s\" fill=\"none\" stroke=\"#1f5fbf\" stroke-width=\"1.8\"/>", path);
    line("  <g fill=\"#1f5fbf\">");
    for (Dot d : f) {
      marker(d.kind(), x.map(d.size()), y.map(d.score()), 3.5);
    }
    line("  </g>");
  }

  private void budget() {
    String bx = num(x.map(chart.budget()));
    line("  <line x1=\"%s\" y1=\"%d\" x2=\"%s\" y2=\"%d\" stroke=\"#c62828\" stroke-width=\"1.5\""
        + " stroke-dasharray=\"6 4\"/>", bx, TOP, bx, HEIGHT - BOTTOM);
    // Above the plot, where no point can hide it, and within the chart's width.
    double at = x.map(chart.budget());
    String anchor = at > WIDTH - RIGHT - 50 ? "end" : at < LEFT + 50 ? "start" : "middle";
    line("  <text x=\"%s\" y=\"%d\" fill=\"#c62828\" text-anchor=\"%s\">budget %d B</text>",
        bx, TOP - 6, anchor, chart.budget());
  }

  private void chosen() {
    Dot c = chart.chosen();
    double cx = x.map(c.size());
    double cy = y.map(c.score());
    line("  <circle cx=\"%s\" cy=\"%s\" r=\"7\" fill=\"none\" stroke=\"#2e7d32\""
        + " stroke-width=\"2.2\"/>", num(cx), num(cy));
    // Below the point, where the rising frontier is not; a white halo keeps it readable.
    boolean leftOfCentre = cx < (LEFT + WIDTH - RIGHT) / 2.0;
    line("  <text x=\"%s\" y=\"%s\" fill=\"#2e7d32\" text-anchor=\"%s\" stroke=\"#ffffff\""
        + " stroke-width=\"4\" paint-order=\"stroke\">chosen: %d B, %s, %s%d %s</text>",
        num(cx + (leftOfCentre ? 6 : -6)), num(Math.min(cy + 24, HEIGHT - BOTTOM - 6)),
        leftOfCentre ? "start" : "end", c.size(), DecimalText.fixed(c.score(), 4),
        chart.chosenTrees() == 1 ? "" : c.kind() + " of " + chart.chosenTrees() + " trees, ",
        chart.chosenLeaves(), chart.chosenLeaves() == 1 ? "leaf" : "leaves");
  }

  /** Sizes past the budget, faintly shaded: what a larger budget would buy. */
  private void overBudget() {
    double bx = x.map(chart.budget());
    double right = WIDTH - RIGHT;
    if (bx < right) {
      line("  <rect x=\"%s\" y=\"%d\" width=\"%s\" height=\"%d\" fill=\"#c62828\""
          + " fill-opacity=\"0.06\"/>", num(bx), TOP, num(right - bx), HEIGHT - BOTTOM - TOP);
    }
  }

  /** One row centred under the size axis's label, so it never covers a point. */
  private void legend() {
    List<String> kinds = kindsDrawn();
    int lx = (LEFT + WIDTH - RIGHT) / 2 - 180 - (kinds.size() > 1 ? 34 * kinds.size() : 0);
    int ly = HEIGHT - 14;
    line("  <g font-size=\"11\" fill=\"#333333\">");
    line("    <circle cx=\"%d\" cy=\"%d\" r=\"2.5\" fill=\"#9a9a9a\"/>", lx + 6, ly);
    line("    <text x=\"%d\" y=\"%d\">candidate</text>", lx + 14, ly + 4);
    lx += 78;
    line("    <path d=\"M%d %d H%d\" stroke=\"#1f5fbf\" stroke-width=\"1.8\"/>", lx, ly,
        lx + 12);
    line("    <circle cx=\"%d\" cy=\"%d\" r=\"3.5\" fill=\"#1f5fbf\"/>", lx + 6, ly);
    line("    <text x=\"%d\" y=\"%d\">Pareto frontier</text>", lx + 18, ly + 4);
    lx += 112;
    line("    <rect x=\"%d\" y=\"%d\" width=\"12\" height=\"12\" fill=\"#c62828\""
        + " fill-opacity=\"0.12\"/>", lx, ly - 6);
    line("    <path d=\"M%d %d V%d\" stroke=\"#c62828\" stroke-width=\"1.5\""
        + " stroke-dasharray=\"3 2\"/>", lx, ly - 6, ly + 6);
    line("    <text x=\"%d\" y=\"%d\">over budget</text>", lx + 18, ly + 4);
    lx += 96;
    line("    <circle cx=\"%d\" cy=\"%d\" r=\"5\" fill=\"none\" stroke=\"#2e7d32\""
        + " stroke-width=\"2\"/>", lx + 6, ly);
    line("    <text x=\"%d\" y=\"%d\">chosen</text>", lx + 16, ly + 4);
    lx += 64;
    if (kinds.size() > 1) {
      for (String kind : kinds) {
        marker(kind, lx + 6, ly, 3.5);
        line("    <text x=\"%d\" y=\"%d\">%s</text>", lx + 14, ly + 4, kind);
        lx += 14 + 7 * kind.length() + 12;
      }
    }
    line("  </g>");
  }

  /** The kinds among the candidates, in legend order. */
  private List<String> kindsDrawn() {
    List<String> kinds = new ArrayList<>();
    for (String kind : KINDS) {
      if (points(chart).stream().anyMatch(d -> d.kind().equals(kind))) {
        kinds.add(kind);
      }
    }
    return kinds;
  }

  /** A tree's circle, a forest's triangle or a boosted ensemble's square, of radius {@code r}. */
  private void marker(String kind, double cx, double cy, double r) {
    switch (kind) {
      case "forest" -> line("    <path d=\"M%s %s L%s %s L%s %sZ\"/>", num(cx), num(cy - 1.3 * r),
          num(cx + 1.15 * r), num(cy + 0.7 * r), num(cx - 1.15 * r), num(cy + 0.7 * r));
      case "boosted" -> line("    <rect x=\"%s\" y=\"%s\" width=\"%s\" height=\"%s\"/>",
          num(cx - 0.9 * r), num(cy - 0.9 * r), num(1.8 * r), num(1.8 * r));
      default -> line("    <circle cx=\"%s\" cy=\"%s\" r=\"%s\"/>", num(cx), num(cy), num(r));
    }
  }

  private void line(String format, Object... args) {
    out.append(String.format(Locale.ROOT, format, args)).append('\n');
  }

  private static String num(double v) {
    String s = DecimalText.fixed(v, 1);
    return s.equals("-0.0") ? "0.0" : s;
  }

  /** Keeps a heading within the chart's width: about 80 characters at these font sizes. */
  private static String shorten(String text) {
    return text.length() <= 80 ? text : text.substring(0, 77) + "...";
  }

  static String escape(String text) {
    StringBuilder b = new StringBuilder(text.length());
    for (char c : text.toCharArray()) {
      switch (c) {
        case '&' -> b.append("&amp;");
        case '<' -> b.append("&lt;");
        case '>' -> b.append("&gt;");
        case '"' -> b.append("&quot;");
        default -> b.append(Character.isISOControl(c) ? ' ' : c);
      }
    }
    return b.toString();
  }

  /** A linear map from data to pixels with round tick values (1, 2 or 5 times a power of ten). */
  static final class Scale {
    final double min;
    final double max;
    private final double from;
    private final double to;
    private final double step;

    private Scale(double min, double max, double from, double to, double step) {
      this.min = min;
      this.max = max;
      this.from = from;
      this.to = to;
      this.step = step;
    }

    /** Widens [lo, hi] to whole ticks, about six of them. */
    static Scale of(double lo, double hi, double from, double to) {
      if (!(hi > lo)) {
        hi = lo + 1;
      }
      double raw = (hi - lo) / 6;
      // StrictMath: Math.log10 and Math.pow may differ in the last bit between JVMs.
      double power = StrictMath.pow(10, Math.floor(StrictMath.log10(raw)));
      double step = power;
      for (double m : new double[] {1, 2, 5, 10}) {
        if (m * power >= raw) {
          step = m * power;
          break;
        }
      }
      double min = Math.floor(lo / step + 1e-9) * step;
      double max = Math.ceil(hi / step - 1e-9) * step;
      return new Scale(min, max, from, to, step);
    }

    double map(double v) {
      return from + (v - min) / (max - min) * (to - from);
    }

    List<Double> ticks() {
      List<Double> ticks = new ArrayList<>();
      long first = Math.round(min / step);
      long last = Math.round(max / step);
      for (long i = first; i <= last; i++) {
        ticks.add(i * step);
      }
      return ticks;
    }

    String label(double v) {
      int decimals = step >= 1 ? 0 : (int) Math.ceil(-StrictMath.log10(step) - 1e-9);
      return DecimalText.fixed(v, decimals);
    }
  }
}
