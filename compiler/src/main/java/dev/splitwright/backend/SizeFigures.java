package dev.splitwright.backend;

import dev.splitwright.report.CompileReport;
import dev.splitwright.select.DexSizes;
import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * What an emitted classifier weighs, as its report states it. Java fills the class-file figures,
 * C the flash figures; the other side is empty.
 *
 * @param sourceBytes UTF-8 bytes of every emitted file
 * @param java class-file figures of the Java back end
 * @param flash flash figures of the C back end
 * @param summary one line for the console, e.g. {@code size: source 1234 bytes, ...}
 */
public record SizeFigures(int sourceBytes, Optional<JavaFigures> java,
    Optional<CompileReport.Flash> flash, String summary) {

  public SizeFigures {
    Objects.requireNonNull(java, "java");
    Objects.requireNonNull(flash, "flash");
    Objects.requireNonNull(summary, "summary");
  }

  /**
   * Sizes of the compiled Java class.
   *
   * @param noDebugBytes the class file compiled with {@code -g:none}
   * @param dex the class dexed by D8, when DEX sizes were asked for
   */
  public record JavaFigures(int classFileBytes, int noDebugBytes, int maxMethodBytes,
      int methodByteCap, int constantPoolCount, List<CompileReport.MethodBytes> methods,
      Optional<DexSizes> dex) {

    public JavaFigures {
      methods = List.copyOf(methods);
      Objects.requireNonNull(dex, "dex");
    }
  }
}
