package dev.splitwright.backend;

import dev.splitwright.cgen.CEmitOptions;
import dev.splitwright.cgen.CEmitter;
import dev.splitwright.cgen.CSource;
import dev.splitwright.check.ElfFile;
import dev.splitwright.data.Dataset;
import dev.splitwright.data.InputException;
import dev.splitwright.emit.HeaderInfo;
import dev.splitwright.model.Classifier;
import dev.splitwright.select.BudgetUnit;
import dev.splitwright.select.SearchMeter;
import dev.splitwright.select.Sizes;
import dev.splitwright.verify.VerificationResult;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.OptionalInt;

/**
 * The budget search's measurements in C: every candidate emitted in the layouts worth measuring,
 * all of a batch compiled to object files in one run of the target compiler ({@link
 * CLanguage#compile}), and its flash bytes read from the ELF section headers. The chosen tree is
 * emitted and checked by {@link CLanguage} itself, so the search and a plain run build the same
 * files.
 */
final class CSearchMeter implements SearchMeter<CLanguage.CEmission> {
  private final CLanguage language;
  private final List<CEmitOptions> variants;
  private int runs;
  private int sources;

  /**
   * Measures flash bytes for {@code language}.
   *
   * @param variants the options of every layout measured per tree
   */
  CSearchMeter(CLanguage language, List<CEmitOptions> variants) {
    this.language = Objects.requireNonNull(language, "language");
    this.variants = List.copyOf(variants);
    if (this.variants.isEmpty()) {
      throw new IllegalArgumentException("no layout to measure");
    }
  }

  @Override
  public BudgetUnit unit() {
    return BudgetUnit.FLASH;
  }

  @Override
  public List<Measured> measure(List<Classifier> models, HeaderInfo header)
      throws InputException {
    List<CSource> emitted = new ArrayList<>(models.size() * variants.size());
    for (Classifier model : models) {
      for (CEmitOptions v : variants) {
        emitted.add(CEmitter.emit(model, v, header));
      }
    }
    List<ElfFile> objects = compile(emitted);
    List<Measured> measured = new ArrayList<>(models.size());
    for (int t = 0; t < models.size(); t++) {
      int pick = CLanguage.leastFlash(objects, t * variants.size(), (t + 1) * variants.size());
      measured.add(new Measured(sizes(emitted.get(pick), objects.get(pick)),
          variants.get(pick % variants.size()).layout()));
    }
    return measured;
  }

  @Override
  public OptionalInt bareSize(Classifier model, HeaderInfo header) throws InputException {
    if (variants.get(0).bare()) {
      return OptionalInt.empty();
    }
    List<CSource> bare = new ArrayList<>();
    for (CEmitOptions v : variants) {
      bare.add(CEmitter.emit(model, v.withBare(true), header));
    }
    return compile(bare).stream()
        .mapToInt(elf -> Math.toIntExact(elf.flashBytes()))
        .min();
  }

  @Override
  public Emitted<CLanguage.CEmission> emit(Classifier model, HeaderInfo header)
      throws InputException {
    runs++;
    sources += variants.size();
    CLanguage.CEmission emission = language.emit(model, header);
    return new Emitted<>(emission, sizes(emission.source(), emission.object()),
        emission.options().layout());
  }

  @Override
  public VerificationResult verify(Classifier model, CLanguage.CEmission emitted,
      List<Dataset> rows, long seed) throws InputException {
    return language.verify(model, emitted, rows, seed);
  }

  @Override
  public ChosenBytes chosenBytes(Emitted<CLanguage.CEmission> emitted) {
    return new ChosenBytes(null, null, null, null, emitted.sizes().flashBytes());
  }

  @Override
  public String compilerName() {
    return language.target().command();
  }

  @Override
  public int compilerRuns() {
    return runs;
  }

  @Override
  public int sourcesCompiled() {
    return sources;
  }

  private List<ElfFile> compile(List<CSource> files) throws InputException {
    runs++;
    sources += files.size();
    return language.compile(files);
  }

  private static Sizes sizes(CSource source, ElfFile object) {
    return Sizes.ofFlash(source.totalBytes(), Math.toIntExact(object.flashBytes()));
  }
}
