package dev.splitwright.emit;

import com.palantir.javapoet.TypeSpec;
import java.util.EnumSet;
import java.util.Set;

/** The private helper methods a class needs, added once each and always in the same order. */
final class SupportMethods {
  /** Helpers in the order they appear in the class. */
  enum Kind {
    /** {@code inSet(v, k, mask, missingLeft)} for at most 64 categories. */
    IN_SET_NARROW,
    /** {@code inSet(v, at, missingLeft)} reading a packed code set. */
    IN_SET_WIDE,
    /** {@code strings(text, lengths)}. */
    STRINGS,
    /** {@code unpack(data, count)}. */
    UNPACK
  }

  private final InputKind input;
  private final Set<Kind> needed = EnumSet.noneOf(Kind.class);

  SupportMethods(InputKind input) {
    this.input = input;
  }

  void need(Kind kind) {
    needed.add(kind);
    if (kind == Kind.STRINGS || kind == Kind.IN_SET_WIDE) {
      needed.add(Kind.UNPACK);
    }
  }

  void addTo(TypeSpec.Builder type) {
    for (Kind kind : needed) {
      type.addMethod(switch (kind) {
        case IN_SET_NARROW -> CategoryHelper.narrow(input);
        case IN_SET_WIDE -> CategoryHelper.wide(input);
        case STRINGS -> StringTable.stringsMethod();
        case UNPACK -> PackedInts.unpackMethod();
      });
    }
  }
}
