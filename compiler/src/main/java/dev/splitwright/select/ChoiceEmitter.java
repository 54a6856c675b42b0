package dev.splitwright.select;

import dev.splitwright.check.CompiledClasses;
import dev.splitwright.data.Dataset;
import dev.splitwright.data.InputException;
import dev.splitwright.emit.EmitOptions;
import dev.splitwright.emit.EmittedSource;
import dev.splitwright.emit.HeaderInfo;
import dev.splitwright.model.DecisionTree;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import java.util.function.Function;

/**
 * Turns the ranking into the emitted classifier: takes the candidates best first, refits each one
 * if the rows differ, emits it with the real header, compiles and measures it, and keeps the first
 * that still fits the budget, noting every one that did not.
 */
final class ChoiceEmitter {
  private final SearchSettings settings;
  private final EmitOptions emit;
  private final CandidateEmitter emitter;

  ChoiceEmitter(SearchSettings settings, EmitOptions emit) {
    this.settings = Objects.requireNonNull(settings, "settings");
    this.emit = Objects.requireNonNull(emit, "emit");
    this.emitter = CandidateEmitter.of(emit);
  }

  /**
   * The candidate taken and the file emitted for it.
   *
   * @param tree the candidate's tree, or its refit
   * @param classes {@code source} compiled under its real name
   * @param fallbacks one line for each better candidate whose emitted file broke the budget
   */
  record Choice(Candidate candidate, DecisionTree tree, EmittedSource source,
      CompiledClasses classes, Sizes sizes, List<String> fallbacks) {

    Choice {
      fallbacks = List.copyOf(fallbacks);
    }
  }

  /**
   * Emits the best ranked candidate whose file fits the budget.
   *
   * @param finalHeader the header of the emitted classifier, given its tree
   * @throws InputException if no ranked candidate fits once emitted
   */
  Choice choose(List<Candidate> ranked, Dataset train, Dataset validation,
      Function<DecisionTree, HeaderInfo> finalHeader, SizeMeter meter) throws InputException {
    Dataset refitRows = settings.refitAll() ? train.concat(validation) : train;
    boolean refit = settings.refitAll() && settings.folds() == 0;
    List<String> fallbacks = new ArrayList<>();
    for (int rank = 0; rank < ranked.size(); rank++) {
      Candidate candidate = ranked.get(rank);
      DecisionTree tree = refit
          ? CandidateGenerator.refit(refitRows, settings, candidate.recipe())
          : candidate.tree();
      Choice best = emitSmallest(candidate, tree, finalHeader.apply(tree), meter, fallbacks);
      int size = best.sizes().in(settings.unit());
      if (size <= settings.budget() && best.sizes().maxMethodBytes() <= emit.maxMethodBytes()) {
        return best;
      }
      fallbacks.add(String.format(Locale.ROOT, "candidate ranked %d (max-depth %d, min-leaf %d, "
          + "alpha %s) weighs %d bytes as emitted%s, over the budget; took the next", rank + 1,
          candidate.recipe().maxDepth(), candidate.recipe().minLeaf(),
          CandidateRecipe.formatAlpha(candidate.recipe().alpha()), size,
          refit ? " after refitting on train+validation" : ""));
    }
    throw new InputException("budget", "no candidate fits the budget of " + settings.budget()
        + " bytes as emitted" + (refit ? " after refitting on train+validation" : ""),
        refit ? "raise --budget or leave out --refit-all" : "raise --budget");
  }

  /** The smallest layout of {@code tree}, compiled under its real name. */
  private Choice emitSmallest(Candidate candidate, DecisionTree tree, HeaderInfo header,
      SizeMeter meter, List<String> fallbacks) {
    Choice best = null;
    for (EmittedSource source : emitter.emit(tree, header)) {
      CompiledClasses classes = meter.compileAlone(source);
      Sizes sizes = meter.measured(classes, source);
      if (best == null || sizes.in(settings.unit()) < best.sizes().in(settings.unit())) {
        best = new Choice(candidate, tree, source, classes, sizes, fallbacks);
      }
    }
    return best;
  }
}
