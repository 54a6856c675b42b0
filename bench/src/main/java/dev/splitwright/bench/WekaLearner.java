package dev.splitwright.bench;

import weka.classifiers.AbstractClassifier;
import weka.classifiers.Classifier;
import weka.classifiers.trees.J48;
import weka.classifiers.trees.REPTree;
import weka.core.Instances;

/** The Weka 3.8.6 trees we compare with, each with the options the benchmarks state. */
enum WekaLearner {
  /** C4.5 with Weka's defaults ({@code -C 0.25 -M 2}); it has no depth limit. */
  J48("J48"),
  /** REPTree with Weka's defaults except {@code -L depth}. */
  REP_TREE("REPTree");

  private final String displayName;

  WekaLearner(String displayName) {
    this.displayName = displayName;
  }

  String displayName() {
    return displayName;
  }

  /** The option strings, as {@code setOptions} takes them, for a depth limit. */
  String[] options(int depth) {
    return switch (this) {
      case J48 -> new String[0];
      case REP_TREE -> new String[] {"-L", Integer.toString(depth)};
    };
  }

  /** A fresh, untrained classifier with {@link #options}. */
  AbstractClassifier create(int depth) throws Exception {
    AbstractClassifier classifier = switch (this) {
      case J48 -> new J48();
      case REP_TREE -> new REPTree();
    };
    classifier.setOptions(options(depth));
    return classifier;
  }

  /** Trains a fresh classifier on {@code data}. */
  Classifier train(Instances data, int depth) throws Exception {
    AbstractClassifier classifier = create(depth);
    classifier.buildClassifier(data);
    return classifier;
  }
}
