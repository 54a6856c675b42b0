package dev.splitwright.job;

import dev.splitwright.backend.OutputLanguage;
import dev.splitwright.data.InputException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * The files a compile run will write, known from the options alone, so that an output location
 * that cannot work is reported before any loading or training, and nothing is touched meanwhile.
 *
 * @param outDir the {@code --out} directory
 * @param sources the emitted files: {@code <out>/<package path>/<Class>.java}, or {@code
 *     <out>/<base>.h} and {@code <out>/<base>.c}
 * @param report {@code <out>/<stem>.report.json}, the stem being the class or base name
 * @param tree {@code <out>/<stem>.tree.svg}, the picture of the tree
 * @param frontier {@code <out>/<stem>.frontier.svg}, written by a budget search
 * @param model the {@code --save-model} file, if any
 */
record OutputTargets(
    Path outDir, List<Path> sources, Path report, Path tree, Optional<Path> frontier,
    Optional<Path> model) {

  static final String OPTION_OUT = "out";
  static final String OPTION_SAVE_MODEL = "save-model";

  OutputTargets {
    Objects.requireNonNull(outDir, "outDir");
    sources = List.copyOf(sources);
    Objects.requireNonNull(report, "report");
    Objects.requireNonNull(tree, "tree");
    Objects.requireNonNull(frontier, "frontier");
    Objects.requireNonNull(model, "model");
  }

  /**
   * The targets of {@code request} emitted in {@code language}; {@code budgetSearch} adds the
   * frontier chart.
   */
  static OutputTargets of(CompileRequest request, OutputLanguage<?> language,
      boolean budgetSearch) {
    String stem = language.stem();
    Path out = request.outDir();
    Optional<Path> frontier = budgetSearch
        ? Optional.of(out.resolve(stem + ".frontier.svg"))
        : Optional.empty();
    List<Path> sources = language.plannedFiles().stream().map(out::resolve).toList();
    return new OutputTargets(out, sources, out.resolve(stem + ".report.json"),
        treeFile(out, stem), frontier, request.saveModel());
  }

  /** {@code <out>/<Class>.tree.svg}; one place for the name, used by the budget run too. */
  static Path treeFile(Path outDir, String className) {
    return outDir.resolve(className + ".tree.svg");
  }

  /**
   * Checks, without creating or writing anything, that every target could be written: the output
   * directory is a directory or can be created, and no target is a directory.
   *
   * @throws InputException naming {@code --out} or {@code --save-model} and what to do
   */
  void check() throws InputException {
    if (Files.exists(outDir) && !Files.isDirectory(outDir)) {
      throw new InputException(OPTION_OUT, outDir + " is a file, not a directory",
          "give a directory path; a missing directory is created");
    }
    for (Path source : sources) {
      checkFile(OPTION_OUT, source);
    }
    checkFile(OPTION_OUT, report);
    checkFile(OPTION_OUT, tree);
    if (frontier.isPresent()) {
      checkFile(OPTION_OUT, frontier.get());
    }
    if (model.isPresent()) {
      checkFile(OPTION_SAVE_MODEL, model.get());
    }
  }

  static void checkFile(String option, Path file) throws InputException {
    if (Files.isDirectory(file)) {
      throw new InputException(option, "cannot write " + file + ": a directory of that name exists",
          "remove or rename that directory, or write elsewhere");
    }
    Path absolute = file.toAbsolutePath().normalize();
    Path existing = absolute.getParent();
    while (existing != null && !Files.exists(existing)) {
      existing = existing.getParent();
    }
    if (existing == null) {
      throw new InputException(option, "cannot write " + file + ": no part of its path exists",
          "give a path on a mounted file system");
    }
    if (!Files.isDirectory(existing)) {
      throw new InputException(option, "cannot write " + file + ": " + existing
          + " is a file, not a directory", "choose a path that does not pass through a file");
    }
    if (!Files.isWritable(existing)) {
      throw new InputException(option, "cannot write " + file + ": directory " + existing
          + " is not writable", "choose a directory you may write to, or change its permissions");
    }
  }
}
