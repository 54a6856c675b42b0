package dev.splitwright.cli;

import static org.assertj.core.api.Assertions.assertThat;

import dev.splitwright.eval.Scores;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

class RecallLineTest {
  @Test
  void printsRecallOfEveryClassAndNaForAClassWithNoRows() {
    // Recall worked by hand: fault 1 of 4, normal 6 of 6; 'worn' has no rows in this part.
    int[][] confusion = {{1, 3, 0}, {0, 6, 0}, {0, 0, 0}};
    String line = RecallLine.format("test", List.of("fault", "normal", "worn"),
        Scores.fromConfusion(confusion));
    assertThat(line).isEqualTo("test       recall per class: fault 0.250, normal 1.000, worn n/a");
  }

  @Test
  void showsOnlyTheLowestRecallsWhenThereAreManyClasses() {
    int k = RecallLine.MAX_SHOWN + 2;
    List<String> classes = new ArrayList<>();
    int[][] confusion = new int[k][k];
    for (int c = 0; c < k; c++) {
      classes.add("c" + (char) ('a' + c));
      // Class c: c + 1 of 20 rows right, so recall rises with the class index ...
      confusion[c][c] = c + 1;
      confusion[c][(c + 1) % k] = 19 - c;
    }
    // ... except the first, now perfect: shown are classes 1 to 12, in class order.
    confusion[0][0] = 20;
    confusion[0][1] = 0;
    String line = RecallLine.format("validation", classes, Scores.fromConfusion(confusion));
    assertThat(line).startsWith("validation recall per class: cb 0.100, cc 0.150,")
        .endsWith(", cm 0.650 (lowest 12 of 14 shown)")
        .doesNotContain("ca ").doesNotContain("cn ");
  }
}
