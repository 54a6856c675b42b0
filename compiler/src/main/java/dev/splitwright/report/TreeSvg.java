package dev.splitwright.report;

import dev.splitwright.data.Feature;
import dev.splitwright.data.Schema;
import dev.splitwright.emit.ThresholdText;
import dev.splitwright.model.CategoricalSplit;
import dev.splitwright.model.ClassCounts;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.Leaf;
import dev.splitwright.model.Node;
import dev.splitwright.model.NumericSplit;
import dev.splitwright.model.Split;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Objects;

/**
 * Draws a decision tree as SVG, top down: a split is a white box with its feature and the rows
 * that reached it, a leaf a rounded box tinted in its class's colour with its class, rows and
 * purity, and under each box a bar of its class mix. Edges are elbows labelled with the test
 * ({@code ≤ t} / {@code > t}, or the category set); a dark diamond marks the edge missing values
 * take. Splits deeper than the drawn depth become dashed boxes that summarise their subtree. Full
 * texts are in {@code <title>} elements; every label is XML-escaped, numbers use {@link
 * Locale#ROOT} and coordinates are integers, so equal trees give equal bytes.
 */
public final class TreeSvg {
  /** Trees up to this depth are drawn whole by default. */
  public static final int DEFAULT_DRAWN_DEPTH = 6;

  private static final int SLOT = 148;
  private static final int BOX_W = 136;
  private static final int BOX_H = 54;
  private static final int LEVEL = 104;
  private static final int MARGIN = 24;
  private static final int MIN_WIDTH = 560;
  private static final int LEGEND_ENTRY = 150;
  private static final int MAX_LEGEND = 24;
  private static final int LABEL_CHARS = 18;
  private static final int EDGE_CHARS = 20;
  private static final String INK = "#33373d";
  // Our own fixed palette; classes past its end reuse it in order (labels tell them apart).
  private static final String[] PALETTE = {"#2f6f8f", "#c8553d", "#6a994e", "#8e5ba6",
      "#d4a017", "#b5446e", "#4f7c6b", "#8a6d3b", "#5c6bc0", "#7f8c8d"};

  private final DecisionTree tree;
  private final Schema schema;
  private final int drawnDepth;
  private final List<Drawn> drawn = new ArrayList<>();
  private final StringBuilder out = new StringBuilder();
  private int slots;

  /** What kind of box a node is drawn as. */
  private enum Kind { SPLIT, LEAF, SUMMARY }

  /** A node as placed: its box centre, its parent's index (-1 for the root) and its side. */
  private record Drawn(Node node, Kind kind, int depth, int x, int parent, boolean left) {}

  private TreeSvg(DecisionTree tree, int drawnDepth) {
    this.tree = tree;
    this.schema = tree.schema();
    this.drawnDepth = drawnDepth;
  }

  /** Draws {@code tree} to {@link #DEFAULT_DRAWN_DEPTH}, headed by {@code title}. */
  public static String render(DecisionTree tree, String title) {
    return render(tree, title, DEFAULT_DRAWN_DEPTH);
  }

  /**
   * Draws {@code tree} headed by {@code title}; splits at depth {@code drawnDepth} (the root has
   * depth 0) and below are shown as one summary box each.
   */
  public static String render(DecisionTree tree, String title, int drawnDepth) {
    Objects.requireNonNull(tree, "tree");
    Objects.requireNonNull(title, "title");
    if (drawnDepth < 1) {
      throw new IllegalArgumentException("drawnDepth must be at least 1: " + drawnDepth);
    }
    TreeSvg svg = new TreeSvg(tree, drawnDepth);
    svg.place(tree.root(), 0, -1, false);
    return svg.draw(title);
  }

  /** Places terminal boxes in slots from left to right, each split centred over its children. */
  private int place(Node node, int depth, int parent, boolean left) {
    int index = drawn.size();
    if (node instanceof Split split && depth < drawnDepth) {
      drawn.add(null);
      int lx = place(split.left(), depth + 1, index, true);
      int rx = place(split.right(), depth + 1, index, false);
      int x = (lx + rx) / 2;
      drawn.set(index, new Drawn(node, Kind.SPLIT, depth, x, parent, left));
      return x;
    }
    int x = MARGIN + slots++ * SLOT + SLOT / 2;
    drawn.add(new Drawn(node, node instanceof Leaf ? Kind.LEAF : Kind.SUMMARY, depth, x, parent,
        left));
    return x;
  }

  private String draw(String title) {
    int levels = drawn.stream().mapToInt(Drawn::depth).max().orElse(0) + 1;
    int width = Math.max(MIN_WIDTH, 2 * MARGIN + slots * SLOT);
    int shown = Math.min(MAX_LEGEND, schema.classCount());
    int perRow = Math.max(1, (width - 2 * MARGIN) / LEGEND_ENTRY);
    int legendRows = (shown + perRow - 1) / perRow + (schema.classCount() > shown ? 1 : 0);
    int top = 92 + legendRows * 20 + 16;
    int height = top + (levels - 1) * LEVEL + BOX_H + MARGIN;

    out.append("<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n");
    out.append(String.format(Locale.ROOT, "<svg xmlns=\"http://www.w3.org/2000/svg\" "
        + "width=\"%d\" height=\"%d\" viewBox=\"0 0 %d %d\" font-family=\"sans-serif\" "
        + "font-size=\"11\" fill=\"%s\">\n", width, height, width, height, INK));
    out.append("<title>").append(esc(title)).append(": decision tree</title>\n");
    out.append(String.format(Locale.ROOT,
        "<rect width=\"%d\" height=\"%d\" fill=\"#fbfaf6\"/>\n", width, height));
    header(title, perRow, shown);
    out.append("<g class=\"edges\" fill=\"none\">\n");
    for (Drawn d : drawn) {
      if (d.parent() >= 0) {
        edge(drawn.get(d.parent()), d, top);
      }
    }
    out.append("</g>\n<g class=\"nodes\">\n");
    for (Drawn d : drawn) {
      box(d, top);
    }
    out.append("</g>\n</svg>\n");
    return out.toString();
  }

  private void header(String title, int perRow, int shown) {
    int rows = tree.root().counts().total();
    out.append(String.format(Locale.ROOT, "<text class=\"heading\" x=\"%d\" y=\"30\" "
        + "font-size=\"16\" font-weight=\"bold\">%s</text>\n", MARGIN, esc(title)));
    String facts = String.format(Locale.ROOT, "depth %d, %d leaves, %d splits, %d training rows",
        tree.depth(), tree.leafCount(), tree.internalNodeCount(), rows);
    if (tree.depth() > drawnDepth) {
      facts += String.format(Locale.ROOT, "; drawn to depth %d, dashed boxes summarise the "
          + "subtrees below", drawnDepth);
    }
    out.append(String.format(Locale.ROOT, "<text class=\"facts\" x=\"%d\" y=\"52\">%s</text>\n",
        MARGIN, esc(facts)));
    out.append(String.format(Locale.ROOT, "<g class=\"key\"><polygon points=\"%s\" fill=\"%s\"/>"
        + "<text x=\"%d\" y=\"76\">marks the edge that missing values take</text></g>\n",
        diamond(MARGIN + 5, 72), INK, MARGIN + 16));
    out.append("<g class=\"legend\">\n");
    for (int c = 0; c < shown; c++) {
      int x = MARGIN + (c % perRow) * LEGEND_ENTRY;
      int y = 92 + (c / perRow) * 20;
      out.append(String.format(Locale.ROOT, "<rect x=\"%d\" y=\"%d\" width=\"12\" height=\"12\" "
          + "rx=\"3\" fill=\"%s\"/><text x=\"%d\" y=\"%d\">%s</text>\n", x, y, colour(c), x + 18,
          y + 10, esc(shorten(schema.classes().get(c), LABEL_CHARS))));
    }
    if (schema.classCount() > shown) {
      int y = 92 + ((shown + perRow - 1) / perRow) * 20;
      out.append(String.format(Locale.ROOT, "<text x=\"%d\" y=\"%d\">and %d more classes, "
          + "coloured in the same order</text>\n", MARGIN, y + 10, schema.classCount() - shown));
    }
    out.append("</g>\n");
  }

  private void edge(Drawn parent, Drawn child, int top) {
    Split split = (Split) parent.node();
    int py = top + parent.depth() * LEVEL + BOX_H;
    int cy = top + child.depth() * LEVEL;
    int mid = py + 16;
    boolean missing = split.missingLeft() == child.left();
    String side = child.left() ? "left" : "right";
    String test = test(split, child.left());
    out.append(String.format(Locale.ROOT, "<g class=\"edge %s%s\"><title>%s %s%s</title>", side,
        missing ? " missing" : "", esc(schema.feature(split.feature()).name()), esc(test),
        missing ? "; missing values go this way" : ""));
    out.append(String.format(Locale.ROOT, "<path d=\"M%d %dV%dH%dV%d\" stroke=\"#8b9096\" "
        + "stroke-width=\"1.5\"/>", parent.x(), py, mid, child.x(), cy));
    out.append(String.format(Locale.ROOT, "<text x=\"%d\" y=\"%d\" fill=\"%s\" "
        + "stroke=\"#fbfaf6\" stroke-width=\"3\" paint-order=\"stroke\">%s</text>",
        child.x() + 5, cy - 9, INK, esc(shorten(test, EDGE_CHARS))));
    if (missing) {
      out.append(String.format(Locale.ROOT, "<polygon class=\"missing-marker\" points=\"%s\" "
          + "fill=\"%s\"/>", diamond(child.x(), mid), INK));
    }
    out.append("</g>\n");
  }

  /** The test an input passes to take this edge, e.g. {@code ≤ 0.53} or {@code in {a, b}}. */
  private String test(Split split, boolean left) {
    if (split instanceof NumericSplit numeric) {
      return (left ? "\u2264 " : "> ") + ThresholdText.of(numeric.threshold());
    }
    Feature feature = schema.feature(split.feature());
    List<String> names = new ArrayList<>();
    for (int code : ((CategoricalSplit) split).leftCodes().toArray()) {
      names.add(code < feature.categories().size() ? feature.categories().get(code)
          : "#" + code);
    }
    return (left ? "in {" : "not in {") + String.join(", ", names) + "}";
  }

  private void box(Drawn d, int top) {
    int x = d.x() - BOX_W / 2;
    int y = top + d.depth() * LEVEL;
    ClassCounts counts = d.node().counts();
    int rows = counts.total();
    switch (d.kind()) {
      case SPLIT -> {
        Split split = (Split) d.node();
        String name = schema.feature(split.feature()).name();
        out.append(String.format(Locale.ROOT, "<g class=\"split\"><title>%s; %s; missing "
            + "values go %s</title>", esc(name), plural(rows, "row"),
            split.missingLeft() ? "left" : "right"));
        out.append(String.format(Locale.ROOT, "<rect x=\"%d\" y=\"%d\" width=\"%d\" "
            + "height=\"%d\" rx=\"3\" fill=\"#ffffff\" stroke=\"%s\" stroke-width=\"1.5\"/>",
            x, y, BOX_W, BOX_H, INK));
        text(x, y + 18, true, shorten(name, LABEL_CHARS));
        text(x, y + 34, false, plural(rows, "row"));
      }
      case LEAF -> {
        Leaf leaf = (Leaf) d.node();
        String label = schema.classes().get(leaf.prediction());
        String purity = rows == 0 ? "purity n/a" : String.format(Locale.ROOT, "%.1f%% pure",
            100.0 * counts.get(leaf.prediction()) / rows);
        String colour = colour(leaf.prediction());
        out.append(String.format(Locale.ROOT, "<g class=\"leaf\"><title>%s; %s; %s</title>",
            esc(label), plural(rows, "row"), purity));
        out.append(String.format(Locale.ROOT, "<rect x=\"%d\" y=\"%d\" width=\"%d\" "
            + "height=\"%d\" rx=\"10\" fill=\"%s\" fill-opacity=\"0.16\" stroke=\"%s\" "
            + "stroke-width=\"2\"/>", x, y, BOX_W, BOX_H, colour, colour));
        text(x, y + 18, true, shorten(label, LABEL_CHARS));
        text(x, y + 34, false, plural(rows, "row") + ", " + purity);
      }
      case SUMMARY -> {
        int[] inside = new int[2];
        count(d.node(), inside);
        String line = "subtree: " + plural(inside[0], "split") + ", "
            + plural(inside[1], "leaf") + ", " + plural(rows, "row");
        out.append(String.format(Locale.ROOT, "<g class=\"summary\"><title>%s</title>",
            esc(line)));
        out.append(String.format(Locale.ROOT, "<rect x=\"%d\" y=\"%d\" width=\"%d\" "
            + "height=\"%d\" rx=\"3\" fill=\"#eeede8\" stroke=\"#7a7d82\" stroke-width=\"1.5\" "
            + "stroke-dasharray=\"5 3\"/>", x, y, BOX_W, BOX_H));
        text(x, y + 18, true, "subtree: " + plural(inside[0], "split"));
        text(x, y + 34, false, plural(inside[1], "leaf") + ", " + plural(rows, "row"));
      }
      default -> throw new IllegalStateException("unknown kind " + d.kind());
    }
    mixBar(x + 8, y + BOX_H - 12, counts);
    out.append("</g>\n");
  }

  private void text(int boxX, int y, boolean bold, String text) {
    out.append(String.format(Locale.ROOT, "<text x=\"%d\" y=\"%d\" text-anchor=\"middle\"%s>%s"
        + "</text>", boxX + BOX_W / 2, y, bold ? " font-weight=\"bold\"" : "", esc(text)));
  }

  /** A thin bar split by class in proportion to the node's rows; integer ends, no gaps. */
  private void mixBar(int x, int y, ClassCounts counts) {
    int width = BOX_W - 16;
    long total = counts.total();
    out.append("<g class=\"mix\">");
    if (total == 0) {
      out.append(String.format(Locale.ROOT, "<rect x=\"%d\" y=\"%d\" width=\"%d\" height=\"5\" "
          + "fill=\"#d0d0cc\"/>", x, y, width));
    }
    long before = 0;
    for (int c = 0; c < counts.classCount() && total > 0; c++) {
      int start = (int) (before * width / total);
      before += counts.get(c);
      int end = (int) (before * width / total);
      if (end > start) {
        out.append(String.format(Locale.ROOT, "<rect x=\"%d\" y=\"%d\" width=\"%d\" "
            + "height=\"5\" fill=\"%s\"/>", x + start, y, end - start, colour(c)));
      }
    }
    out.append("</g>");
  }

  /** Counts splits ({@code into[0]}) and leaves ({@code into[1]}) of a subtree. */
  private static void count(Node node, int[] into) {
    if (node instanceof Split split) {
      into[0]++;
      count(split.left(), into);
      count(split.right(), into);
    } else {
      into[1]++;
    }
  }

  private static String plural(int n, String noun) {
    String word = n == 1 ? noun : noun.equals("leaf") ? "leaves" : noun + "s";
    return n + " " + word;
  }

  private static String colour(int classIndex) {
    return PALETTE[classIndex % PALETTE.length];
  }

  private static String diamond(int cx, int cy) {
    return String.format(Locale.ROOT, "%d,%d %d,%d %d,%d %d,%d", cx, cy - 5, cx + 5, cy, cx,
        cy + 5, cx - 5, cy);
  }

  /** Cuts {@code text} to {@code max} code points, ending in an ellipsis when cut. */
  static String shorten(String text, int max) {
    if (text.codePointCount(0, text.length()) <= max) {
      return text;
    }
    return text.substring(0, text.offsetByCodePoints(0, max - 1)) + "\u2026";
  }

  /**
   * Escapes text for XML content and attributes. Characters XML 1.0 cannot hold at all (controls,
   * lone surrogates, U+FFFE, U+FFFF) and line separators are shown as {@code \\uXXXX}.
   */
  static String esc(String text) {
    StringBuilder b = new StringBuilder(text.length() + 16);
    text.codePoints().forEach(cp -> {
      switch (cp) {
        case '&' -> b.append("&amp;");
        case '<' -> b.append("&lt;");
        case '>' -> b.append("&gt;");
        case '"' -> b.append("&quot;");
        case '\'' -> b.append("&apos;");
        default -> {
          if (cp < 0x20 || (cp >= 0x7f && cp <= 0x9f) || cp == 0x2028 || cp == 0x2029
              || (cp >= 0xd800 && cp <= 0xdfff) || cp == 0xfffe || cp == 0xffff) {
            b.append(String.format(Locale.ROOT, "\\u%04x", cp));
          } else {
            b.appendCodePoint(cp);
          }
        }
      }
    });
    return b.toString();
  }
}
