package dev.splitwright.select;

import dev.splitwright.check.CompiledClasses;
import dev.splitwright.emit.EmitOptions;
import dev.splitwright.emit.EmittedSource;
import dev.splitwright.emit.Layout;
import java.util.Collections;
import java.util.EnumMap;
import java.util.Locale;
import java.util.Map;
import java.util.Objects;
import java.util.StringJoiner;

/**
 * The layout a run emits, with its source and compiled class, and the class-file bytes of every
 * layout that was compiled to choose it (one entry unless {@code smallest} was asked for).
 *
 * @param options the options with the layout that was kept, never {@link Layout#SMALLEST}
 * @param classFileBytes class-file bytes by layout, in layout order
 * @param note why a layout was left out without being measured, or empty
 */
public record LayoutChoice(EmittedSource source, EmitOptions options, CompiledClasses classes,
    Map<Layout, Integer> classFileBytes, String note) {

  public LayoutChoice {
    Objects.requireNonNull(source, "source");
    Objects.requireNonNull(options, "options");
    Objects.requireNonNull(classes, "classes");
    Objects.requireNonNull(note, "note");
    if (options.layout() == Layout.SMALLEST) {
      throw new IllegalArgumentException("a choice names the layout it kept");
    }
    classFileBytes = Collections.unmodifiableMap(new EnumMap<>(classFileBytes));
  }

  /** One line such as {@code table: 5210 bytes (branches 9876 bytes)}. */
  public String describe() {
    return describe(options.layout(), note);
  }

  /** As {@link #describe()}, naming {@code kept} as the layout kept and ending in {@code note}. */
  public String describe(Layout kept, String note) {
    StringJoiner others = new StringJoiner(", ", " (", ")").setEmptyValue("");
    classFileBytes.forEach((layout, bytes) -> {
      if (layout != kept) {
        others.add(String.format(Locale.ROOT, "%s %d bytes", layout.optionName(), bytes));
      }
    });
    Integer bytes = classFileBytes.get(kept);
    String text = kept.optionName() + (bytes == null ? "" : ": " + bytes + " bytes") + others;
    return note.isEmpty() ? text : text + "; " + note;
  }
}
