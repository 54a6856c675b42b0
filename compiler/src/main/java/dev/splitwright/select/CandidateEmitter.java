package dev.splitwright.select;

import dev.splitwright.emit.EmitOptions;
import dev.splitwright.emit.EmittedSource;
import dev.splitwright.emit.HeaderInfo;
import dev.splitwright.emit.JavaEmitter;
import dev.splitwright.emit.Layout;
import dev.splitwright.model.Classifier;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;

/**
 * Emits a tree as source, once per layout worth measuring: the chosen layout, or every concrete
 * layout when the options ask for {@link Layout#SMALLEST}.
 */
@FunctionalInterface
public interface CandidateEmitter {

  /** The sources of {@code model}, all with the same class name, one per layout. */
  List<EmittedSource> emit(Classifier model, HeaderInfo header);

  /** Emits with {@link JavaEmitter} and {@code options}. */
  static CandidateEmitter of(EmitOptions options) {
    Objects.requireNonNull(options, "options");
    List<Layout> layouts = new ArrayList<>();
    if (options.layout() == Layout.SMALLEST) {
      for (Layout layout : Layout.values()) {
        if (layout != Layout.SMALLEST && layout != Layout.FLAT) {
          layouts.add(layout);
        }
      }
    } else {
      layouts.add(options.layout());
    }
    return (model, header) -> layouts.stream()
        .map(layout -> JavaEmitter.emit(model, options.toBuilder().layout(layout).build(), header))
        .toList();
  }
}
