package dev.splitwright.eval;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import dev.splitwright.data.CsvLoader;
import dev.splitwright.data.Dataset;
import java.net.URISyntaxException;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;
import java.util.stream.IntStream;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class StratifiedSplitTest {

  private static Dataset cancer;

  @BeforeAll
  static void load() throws Exception {
    cancer = CsvLoader.load(dataset("breast-cancer-wisconsin-diagnostic.csv")).dataset();
  }

  private static Path dataset(String name) throws URISyntaxException {
    return Path.of(StratifiedSplitTest.class.getResource("/datasets/" + name).toURI());
  }

  @Test
  void givesEachClassItsShareOfEveryPart() {
    SplitParts parts = StratifiedSplit.split(cancer, 0.6, 0.2, 0.2, 42);

    // Worked by hand: 357 benign -> 214.2 / 71.4 / 71.4 -> 214, 72, 71 (the leftover row goes to
    // the first of the tied remainders); 212 malignant -> 127.2 / 42.4 / 42.4 -> 127, 43, 42.
    assertThat(parts.train().classCounts()).containsExactly(214, 127);
    assertThat(parts.validation().classCounts()).containsExactly(72, 43);
    assertThat(parts.test().classCounts()).containsExactly(71, 42);
  }

  @Test
  void partsAreDisjointCoverEveryRowAndKeepOriginalOrder() {
    SplitParts parts = StratifiedSplit.split(cancer, 0.6, 0.2, 0.2, 7);

    int[] all =
        IntStream.concat(
                IntStream.concat(
                    Arrays.stream(parts.trainRows()), Arrays.stream(parts.validationRows())),
                Arrays.stream(parts.testRows()))
            .sorted()
            .toArray();
    assertThat(all).containsExactly(IntStream.range(0, cancer.rows()).toArray());
    assertThat(parts.trainRows()).isSorted();
    assertThat(parts.validationRows()).isSorted();
    assertThat(parts.testRows()).isSorted();
    int[] testRows = parts.testRows();
    for (int i = 0; i < testRows.length; i++) {
      assertThat(parts.test().row(i)).containsExactly(cancer.row(testRows[i]));
      assertThat(parts.test().label(i)).isEqualTo(cancer.label(testRows[i]));
    }
  }

  @Test
  void sameSeedGivesTheSameSplit() {
    SplitParts first = StratifiedSplit.split(cancer, 0.6, 0.2, 0.2, 123);
    SplitParts second = StratifiedSplit.split(cancer, 0.6, 0.2, 0.2, 123);

    assertThat(second.trainRows()).containsExactly(first.trainRows());
    assertThat(second.validationRows()).containsExactly(first.validationRows());
    assertThat(second.testRows()).containsExactly(first.testRows());
  }

  @Test
  void anotherSeedGivesAnotherSplit() {
    SplitParts first = StratifiedSplit.split(cancer, 0.6, 0.2, 0.2, 123);
    SplitParts second = StratifiedSplit.split(cancer, 0.6, 0.2, 0.2, 124);

    assertThat(second.testRows()).isNotEqualTo(first.testRows());
    assertThat(second.test().classCounts()).containsExactly(first.test().classCounts());
  }

  @Test
  void shufflesRatherThanTakingTheFirstRowsOfEachClass() {
    SplitParts parts = StratifiedSplit.split(cancer, 0.6, 0.2, 0.2, 1);

    // Row 568 is the last row; taking rows in file order would always put it in the test part.
    int[] train = parts.trainRows();
    assertThat(train[train.length - 1]).isGreaterThan(500);
    assertThat(parts.testRows()[0]).isLessThan(100);
  }

  @ParameterizedTest
  @CsvSource({
    // n, train, validation, test, expected counts (worked by hand)
    "3, 0.8, 0.1, 0.1, 1 1 1",
    "2, 0.8, 0.1, 0.1, 2 0 0",
    "10, 0.7, 0.3, 0.0, 7 3 0",
    "4, 0.5, 0.25, 0.25, 2 1 1",
    "7, 0.6, 0.2, 0.2, 4 2 1",
    "1, 0.0, 0.0, 1.0, 0 0 1",
    "0, 0.6, 0.2, 0.2, 0 0 0",
    "5, 0.9, 0.1, 0.0, 4 1 0",
    // Too few rows for every part: the train part still gets one (worked by hand).
    "1, 0.2, 0.4, 0.4, 1 0 0",
    "2, 0.2, 0.4, 0.4, 1 0 1",
    "1, 0.1, 0.9, 0.0, 1 0 0"
  })
  void allocatesByLargestRemainderAndFillsEveryNonEmptyPart(
      int n, double train, double validation, double test, String expected) {
    int[] counts = StratifiedSplit.allocate(n, new double[] {train, validation, test});

    assertThat(counts)
        .containsExactly(Arrays.stream(expected.split(" ")).mapToInt(Integer::parseInt).toArray());
  }

  @Test
  void putsARareClassIntoEveryPart() {
    float[][] columns = {new float[20]};
    int[] labels = new int[20];
    labels[3] = 1;
    labels[11] = 1;
    labels[17] = 1;
    Dataset data =
        Dataset.of(
            new dev.splitwright.data.Schema(
                List.of(dev.splitwright.data.Feature.numeric("x")), "y", List.of("common", "rare")),
            columns,
            labels);

    SplitParts parts = StratifiedSplit.split(data, 0.8, 0.1, 0.1, 5);

    assertThat(parts.train().classCounts()[1]).isEqualTo(1);
    assertThat(parts.validation().classCounts()[1]).isEqualTo(1);
    assertThat(parts.test().classCounts()[1]).isEqualTo(1);
  }

  @ParameterizedTest
  @CsvSource({"0.6, 0.2, 0.3", "0.5, 0.5, -0.0001", "1.0, 0.0, NaN", "0.6, 0.2, 0.19999999"})
  void rejectsFractionsThatAreNegativeOrDoNotSumToOne(double a, double b, double c) {
    assertThatThrownBy(() -> StratifiedSplit.split(cancer, a, b, c, 1))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessage(
            "train, validation and test fractions must be >= 0 and sum to 1, but they are "
                + a
                + ", "
                + b
                + ", "
                + c);
  }

  @Test
  void acceptsFractionsWithinTheTolerance() {
    SplitParts parts = StratifiedSplit.split(cancer, 0.7, 0.2, 0.1 + 5e-10, 1);

    assertThat(parts.train().rows() + parts.validation().rows() + parts.test().rows())
        .isEqualTo(569);
  }

  @Test
  void kFoldHoldsOutEveryRowExactlyOnceWithBalancedClasses() {
    List<Fold> folds = StratifiedSplit.kFold(cancer, 5, 3);

    assertThat(folds).hasSize(5);
    int[] timesHeldOut = new int[cancer.rows()];
    for (Fold fold : folds) {
      for (int row : fold.validationRows()) {
        timesHeldOut[row]++;
      }
      assertThat(fold.validationRows()).isSorted();
      assertThat(fold.trainRows()).isSorted();
      assertThat(fold.train().rows() + fold.validation().rows()).isEqualTo(569);
      // 357 / 5 = 71.4 and 212 / 5 = 42.4: each fold holds 71 or 72 benign, 42 or 43 malignant.
      int[] held = fold.validation().classCounts();
      assertThat(held[0]).isBetween(71, 72);
      assertThat(held[1]).isBetween(42, 43);
      assertThat(fold.validation().rows()).isBetween(113, 114);
    }
    assertThat(timesHeldOut).containsOnly(1);
  }

  @Test
  void kFoldIsDeterministicPerSeed() {
    List<Fold> first = StratifiedSplit.kFold(cancer, 4, 9);
    List<Fold> again = StratifiedSplit.kFold(cancer, 4, 9);
    List<Fold> other = StratifiedSplit.kFold(cancer, 4, 10);

    for (int i = 0; i < 4; i++) {
      assertThat(again.get(i).validationRows()).containsExactly(first.get(i).validationRows());
    }
    assertThat(other.get(0).validationRows()).isNotEqualTo(first.get(0).validationRows());
  }

  @Test
  void kFoldRejectsTooFewOrTooManyFolds() {
    assertThatThrownBy(() -> StratifiedSplit.kFold(cancer, 1, 1))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessage("k must be at least 2, but it is 1");
    assertThatThrownBy(() -> StratifiedSplit.kFold(cancer, 570, 1))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessage("k must not exceed the 569 rows, but it is 570");
  }
}
