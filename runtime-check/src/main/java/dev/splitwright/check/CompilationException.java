package dev.splitwright.check;

import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.stream.Collectors;
import javax.tools.Diagnostic;

/**
 * javac rejected a batch. The message lists every diagnostic followed by the offending source line
 * with its number and a caret, so a failing test shows what was generated and what javac said.
 */
public final class CompilationException extends Exception {

  private static final long serialVersionUID = 1L;

  private final List<CompileDiagnostic> diagnostics;

  CompilationException(List<CompileDiagnostic> diagnostics, List<SourceFile> sources) {
    super(render(diagnostics, sources));
    this.diagnostics = List.copyOf(diagnostics);
  }

  /** All diagnostics of the failed compilation, in javac's order, warnings and notes included. */
  public List<CompileDiagnostic> diagnostics() {
    return diagnostics;
  }

  /** Only the diagnostics of kind {@link Diagnostic.Kind#ERROR}. */
  public List<CompileDiagnostic> errors() {
    return diagnostics.stream().filter(d -> d.kind() == Diagnostic.Kind.ERROR).toList();
  }

  private static String render(List<CompileDiagnostic> diagnostics, List<SourceFile> sources) {
    Objects.requireNonNull(diagnostics, "diagnostics");
    Map<String, String> byName =
        sources.stream()
            .collect(Collectors.toMap(SourceFile::binaryClassName, SourceFile::source));
    long errorCount = diagnostics.stream().filter(d -> d.kind() == Diagnostic.Kind.ERROR).count();
    StringBuilder out =
        new StringBuilder("compilation failed with ")
            .append(errorCount)
            .append(errorCount == 1 ? " error" : " errors");
    if (diagnostics.isEmpty()) {
      out.append(" and no diagnostics");
    }
    for (CompileDiagnostic d : diagnostics) {
      out.append('\n').append(d.headline());
      String source = byName.get(d.className());
      if (source == null || !d.hasPosition()) {
        continue;
      }
      List<String> lines = source.lines().toList();
      if (d.line() > lines.size()) {
        continue;
      }
      String text = lines.get((int) d.line() - 1);
      out.append('\n').append(gutter(Long.toString(d.line()))).append(text);
      if (d.column() > 0) {
        out.append('\n').append(gutter("")).append(" ".repeat((int) d.column() - 1)).append('^');
      }
    }
    return out.toString();
  }

  private static String gutter(String lineNumber) {
    return " ".repeat(Math.max(0, 6 - lineNumber.length())) + lineNumber + " | ";
  }
}
