package dev.splitwright.select;

import dev.splitwright.data.Dataset;
import dev.splitwright.data.InputException;
import dev.splitwright.emit.HeaderInfo;
import dev.splitwright.model.Classifier;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import java.util.function.Function;

/**
 * Turns the ranking into the emitted classifier: takes the candidates best first, refits each one
 * if the rows differ, emits it with the real header, compiles and measures it, and keeps the first
 * that still fits the budget, noting every one that did not.
 *
 * @param <E> what the language emits
 */
final class ChoiceEmitter<E> {
  private final SearchSettings settings;
  private final SearchMeter<E> meter;

  ChoiceEmitter(SearchSettings settings, SearchMeter<E> meter) {
    this.settings = Objects.requireNonNull(settings, "settings");
    this.meter = Objects.requireNonNull(meter, "meter");
  }

  /**
   * The candidate taken and the file emitted for it.
   *
   * @param model the candidate's tree or ensemble, or its refit
   * @param fallbacks one line for each better candidate whose emitted file broke the budget
   */
  record Choice<E>(Candidate candidate, Classifier model, SearchMeter.Emitted<E> emitted,
      List<String> fallbacks) {

    Choice {
      fallbacks = List.copyOf(fallbacks);
    }

    Sizes sizes() {
      return emitted.sizes();
    }
  }

  /**
   * Emits the best ranked candidate whose file fits the budget.
   *
   * @param finalHeader the header of the emitted classifier, given its tree
   * @throws InputException if no ranked candidate fits once emitted
   */
  Choice<E> choose(List<Candidate> ranked, Dataset train, Dataset validation,
      Function<Classifier, HeaderInfo> finalHeader) throws InputException {
    Dataset refitRows = settings.refitAll() ? train.concat(validation) : train;
    boolean refit = settings.refitAll() && settings.folds() == 0;
    List<String> fallbacks = new ArrayList<>();
    for (int rank = 0; rank < ranked.size(); rank++) {
      Candidate candidate = ranked.get(rank);
      Classifier model = refit
          ? CandidateGenerator.refit(refitRows, settings, candidate.recipe())
          : candidate.model();
      SearchMeter.Emitted<E> emitted = meter.emit(model, finalHeader.apply(model));
      int size = emitted.sizes().in(settings.unit());
      if (size <= settings.budget() && meter.usable(emitted.sizes())) {
        return new Choice<>(candidate, model, emitted, fallbacks);
      }
      fallbacks.add(String.format(Locale.ROOT, "candidate ranked %d (%s) weighs %d bytes as "
          + "emitted%s, over the budget; took the next", rank + 1, candidate.recipe().describe(),
          size, refit ? " after refitting on train+validation" : ""));
    }
    throw new InputException("budget", "no candidate fits the budget of " + settings.budget()
        + " bytes as emitted" + (refit ? " after refitting on train+validation" : ""),
        refit ? "raise --budget or leave out --refit-all" : "raise --budget");
  }
}
