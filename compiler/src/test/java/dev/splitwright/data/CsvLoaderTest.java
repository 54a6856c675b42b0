package dev.splitwright.data;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.net.URISyntaxException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.util.HexFormat;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class CsvLoaderTest {

  @TempDir Path dir;

  static Path dataset(String name) {
    try {
      return Path.of(CsvLoaderTest.class.getResource("/datasets/" + name).toURI());
    } catch (URISyntaxException e) {
      throw new IllegalStateException(e);
    }
  }

  private Path write(String content) throws IOException {
    return Files.write(dir.resolve("t.csv"), content.getBytes(StandardCharsets.UTF_8));
  }

  @Test
  void loadsBreastCancerWithTheClassDistributionUciPublishes() throws Exception {
    LoadedData loaded = CsvLoader.load(dataset("breast-cancer-wisconsin-diagnostic.csv"));
    Dataset data = loaded.dataset();

    assertThat(loaded.dataRows()).isEqualTo(569);
    assertThat(loaded.sourceName()).isEqualTo("breast-cancer-wisconsin-diagnostic.csv");
    // coreutils sha256sum of the file (see src/test/resources/datasets/README.md).
    assertThat(loaded.sha256())
        .isEqualTo("1459c6f42006b97a8e6d623f2857115c0a8fbf372d078edf1cacfcf99f8acc32");
    assertThat(data.schema().featureCount()).isEqualTo(30);
    assertThat(data.schema().features()).allMatch(f -> f.kind() == FeatureKind.NUMERIC);
    assertThat(data.schema().target()).isEqualTo("diagnosis");
    assertThat(data.schema().classes()).containsExactly("benign", "malignant");
    // UCI data set description: "Class distribution: 357 benign, 212 malignant".
    assertThat(data.classCounts()).containsExactly(357, 212);
    // First data row of the file: radius_mean 17.99 ... fractal_dimension_worst 0.1189, malignant.
    assertThat(data.value(0, 0)).isEqualTo(17.99f);
    assertThat(data.value(0, 29)).isEqualTo(0.1189f);
    assertThat(data.label(0)).isEqualTo(1);
  }

  @Test
  void loadsPimaEmptyCellsAsNaN() throws Exception {
    Path file = dataset("pima-indians-diabetes-2.csv");
    LoadedData loaded = CsvLoader.load(file);
    Dataset data = loaded.dataset();

    assertThat(loaded.sha256())
        .isEqualTo("707589c30ee7c2cc4990d6c6e3075dff1b39f25f1f83bb0ade3c22a152e5c438");
    assertThat(data.schema().featureNames())
        .containsExactly(
            "pregnant", "glucose", "pressure", "triceps", "insulin", "mass", "pedigree", "age");
    assertThat(data.schema().features()).allMatch(f -> f.kind() == FeatureKind.NUMERIC);
    assertThat(data.schema().classes()).containsExactly("neg", "pos");
    // UCI description (from memory): 500 tested negative, 268 tested positive.
    assertThat(data.classCounts()).containsExactly(500, 268);
    assertThat(nanCounts(data))
        .containsExactly(java.util.Arrays.copyOf(emptyCellCounts(file, 9), 8));
    // Known missing counts of PimaIndiansDiabetes2 (mlbench documentation, from memory).
    assertThat(nanCounts(data)).containsExactly(0, 5, 35, 227, 374, 11, 0, 0);
  }

  @Test
  void loadsHouseVotesWithTheTargetInTheFirstColumn() throws Exception {
    Path file = dataset("house-votes-84.csv");
    LoadedData loaded = CsvLoader.load(file, LoadOptions.builder().target("Class").build());
    Dataset data = loaded.dataset();

    assertThat(data.schema().target()).isEqualTo("Class");
    assertThat(data.schema().featureCount()).isEqualTo(16);
    assertThat(data.schema().featureNames().get(0)).isEqualTo("V1");
    assertThat(data.schema().features())
        .allSatisfy(f -> assertThat(f.categories()).containsExactly("n", "y"));
    assertThat(data.schema().classes()).containsExactly("democrat", "republican");
    // UCI description: "Class Distribution: 267 democrats, 168 republicans".
    assertThat(data.classCounts()).containsExactly(267, 168);
    int[] emptyCells = emptyCellCounts(file, 17);
    int[] expectedNaN = new int[16];
    System.arraycopy(emptyCells, 1, expectedNaN, 0, 16);
    assertThat(nanCounts(data)).containsExactly(expectedNaN);
    // First data row: "republican","n","y",... with V11 empty.
    assertThat(data.label(0)).isEqualTo(1);
    assertThat(data.value(0, 0)).isEqualTo(0f);
    assertThat(data.value(0, 1)).isEqualTo(1f);
    assertThat(data.value(0, 10)).isNaN();
  }

  private static int[] nanCounts(Dataset data) {
    int[] counts = new int[data.featureCount()];
    for (int f = 0; f < counts.length; f++) {
      for (float v : data.column(f)) {
        if (Float.isNaN(v)) {
          counts[f]++;
        }
      }
    }
    return counts;
  }

  /** Counts empty cells per column with a plain split: independent of the loader. */
  private static int[] emptyCellCounts(Path file, int columns) throws IOException {
    List<String> lines = Files.readAllLines(file, StandardCharsets.UTF_8);
    int[] counts = new int[columns];
    for (String line : lines.subList(1, lines.size())) {
      String[] cells = line.split(",", -1);
      assertThat(cells).hasSize(columns);
      for (int c = 0; c < columns; c++) {
        if (cells[c].isEmpty()) {
          counts[c]++;
        }
      }
    }
    return counts;
  }

  @Test
  void acceptsUtf8ByteOrderMarkAndHashesIt() throws Exception {
    byte[] bom = {(byte) 0xEF, (byte) 0xBB, (byte) 0xBF};
    byte[] body = "temp,state\n1.5,ok\n".getBytes(StandardCharsets.UTF_8);
    byte[] bytes = new byte[bom.length + body.length];
    System.arraycopy(bom, 0, bytes, 0, 3);
    System.arraycopy(body, 0, bytes, 3, body.length);
    Path file = Files.write(dir.resolve("bom.csv"), bytes);

    LoadedData loaded = CsvLoader.load(file);

    assertThat(loaded.dataset().schema().featureNames()).containsExactly("temp");
    assertThat(loaded.sha256())
        .isEqualTo(HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(bytes)));
  }

  @Test
  void acceptsCrlfLineEndings() throws Exception {
    Path file = write("a,label\r\n1,x\r\n2,y\r\n");

    Dataset data = CsvLoader.load(file).dataset();

    assertThat(data.column(0)).containsExactly(1f, 2f);
    assertThat(data.schema().classes()).containsExactly("x", "y");
  }

  @Test
  void keepsQuotedCommasAndNewlinesInsideCells() throws Exception {
    Path file = write("site,label\n\"north,\nwell 2\",x\n\"a \"\"b\"\"\",y\n");

    Dataset data = CsvLoader.load(file).dataset();

    assertThat(data.schema().feature(0).categories()).containsExactly("a \"b\"", "north,\nwell 2");
    assertThat(data.column(0)).containsExactly(1f, 0f);
  }

  @Test
  void loadsAFileWhoseLastLineHasNoLineBreak() throws Exception {
    // Found by CsvFuzzTest: the parser reads again after the end, which crashed the decoder.
    for (String last : List.of("3,x", "3,\"x\"", "3,café")) {
      Path file = write("a,label\n1,x\n2,y\n" + last);

      Dataset data = CsvLoader.load(file).dataset();

      assertThat(data.rows()).as(last).isEqualTo(3);
      assertThat(data.column(0)).as(last).containsExactly(1f, 2f, 3f);
    }
  }

  @Test
  void skipsBlankLines() throws Exception {
    Path file = write("a,label\n\n1,x\n\r\n2,y\n\n");

    assertThat(CsvLoader.load(file).dataRows()).isEqualTo(2);
  }

  @Test
  void readsMissingTokensAsNaN() throws Exception {
    Path file = write("a,b,label\n1,NA,x\n?,y,y\n,n,x\n4, NA ,y\n");

    Dataset data =
        CsvLoader.load(file, LoadOptions.builder().missingTokens(List.of("NA", "?")).build())
            .dataset();

    assertThat(data.column(0)).containsExactly(1f, Float.NaN, Float.NaN, 4f);
    assertThat(data.schema().feature(1).categories()).containsExactly("n", "y");
    assertThat(data.column(1)).containsExactly(Float.NaN, 1f, 0f, Float.NaN);
  }

  @Test
  void readsNaNTextAsMissingOnlyWhenDeclaredAMissingToken() throws Exception {
    Path file = write("a,label\n1,x\nNaN,y\n");

    Dataset data =
        CsvLoader.load(file, LoadOptions.builder().missingTokens(List.of("NaN")).build()).dataset();

    assertThat(data.schema().feature(0).kind()).isEqualTo(FeatureKind.NUMERIC);
    assertThat(data.column(0)).containsExactly(1f, Float.NaN);
  }

  @Test
  void trimsCellsAndHeaderNames() throws Exception {
    Path file = write(" a , b ,label\n 1.5 , y ,x \n");

    Dataset data = CsvLoader.load(file).dataset();

    assertThat(data.schema().featureNames()).containsExactly("a", "b");
    assertThat(data.value(0, 0)).isEqualTo(1.5f);
    assertThat(data.schema().feature(1).categories()).containsExactly("y");
    assertThat(data.schema().classes()).containsExactly("x");
  }

  @Test
  void codesCategoriesAndLabelsInSortedOrderWhateverTheRowOrder() throws Exception {
    Path one = Files.writeString(dir.resolve("one.csv"), "c,label\nz,b\na,a\nm,c\n");
    Path two = Files.writeString(dir.resolve("two.csv"), "c,label\nm,c\nz,b\na,a\n");

    Dataset first = CsvLoader.load(one).dataset();
    Dataset second = CsvLoader.load(two).dataset();

    assertThat(first.schema()).isEqualTo(second.schema());
    assertThat(first.schema().feature(0).categories()).containsExactly("a", "m", "z");
    assertThat(first.schema().classes()).containsExactly("a", "b", "c");
    assertThat(first.column(0)).containsExactly(2f, 0f, 1f);
    assertThat(first.labels()).containsExactly(1, 0, 2);
  }

  @Test
  void makesAColumnCategoricalWhenOneCellIsText() throws Exception {
    // NaN and overflow texts are then category names like any other.
    Path file = write("c,label\n1,x\nNaN,x\n1e39,y\nlow,y\n");

    Dataset data = CsvLoader.load(file).dataset();

    assertThat(data.schema().feature(0).categories()).containsExactly("1", "1e39", "NaN", "low");
  }

  @Test
  void readsDeclaredCategoricalNumbersAsCategoriesInStringOrder() throws Exception {
    Path file = write("gear,label\n2,x\n10,y\n1,x\n");

    Dataset data =
        CsvLoader.load(file, LoadOptions.builder().categoricalColumns(List.of("gear")).build())
            .dataset();

    assertThat(data.schema().feature(0).categories()).containsExactly("1", "10", "2");
    assertThat(data.column(0)).containsExactly(2f, 1f, 0f);
  }

  @Test
  void loadsASingleClassFile() throws Exception {
    Dataset data = CsvLoader.load(write("a,label\n1,x\n2,x\n")).dataset();

    assertThat(data.schema().classes()).containsExactly("x");
  }

  @Test
  void readsAnAllMissingColumnAsNumeric() throws Exception {
    Dataset data = CsvLoader.load(write("a,b,label\n,1,x\n,2,y\n")).dataset();

    assertThat(data.schema().feature(0).kind()).isEqualTo(FeatureKind.NUMERIC);
    assertThat(data.column(0)).containsExactly(Float.NaN, Float.NaN);
  }

  @Test
  void mapsATestFileThroughTheTrainingSchemaByName() throws Exception {
    Path train =
        Files.writeString(dir.resolve("train.csv"), "speed,site,label\n1,north,x\n2,south,y\n");
    Path test =
        Files.writeString(dir.resolve("test.csv"), "label,site,speed\ny,south,3\nx,east,4\nx,,5\n");
    Schema schema = CsvLoader.load(train).dataset().schema();

    LoadedData loaded = CsvLoader.loadWithSchema(test, schema, LoadOptions.defaults());
    Dataset data = loaded.dataset();

    assertThat(data.schema()).isEqualTo(schema);
    assertThat(loaded.dataRows()).isEqualTo(3);
    assertThat(data.column(0)).containsExactly(3f, 4f, 5f);
    // "east" was never seen in training: it loads as missing, like the empty cell below it.
    assertThat(data.column(1)).containsExactly(1f, Float.NaN, Float.NaN);
    assertThat(data.labels()).containsExactly(1, 0, 0);
    assertThat(CsvLoader.load(train).dataset().concat(data).rows()).isEqualTo(5);
  }

  @Test
  void decodesMultiByteCharactersAcrossReadBuffers() throws Exception {
    // 2-, 3- and 4-byte UTF-8 sequences (RFC 3629) at every offset modulo the 64 KiB read buffer.
    List<String> sites = List.of("café", "Straße", "東京", "🔥pit");
    StringBuilder text = new StringBuilder("site,reading,label\n");
    int rows = 30_000;
    for (int i = 0; i < rows; i++) {
      text.append(sites.get(i % 4))
          .append(',')
          .append(i % 7)
          .append(",x")
          .append(i % 3)
          .append('\n');
    }

    Dataset data = CsvLoader.load(write(text.toString())).dataset();

    assertThat(data.rows()).isEqualTo(rows);
    assertThat(data.schema().feature(0).categories())
        .containsExactly("Straße", "café", "東京", "🔥pit");
    // Row 29999 is site 29999 % 4 = 3, "🔥pit", last in UTF-16 order (high surrogate 0xD83D).
    assertThat(data.value(rows - 1, 0)).isEqualTo(3f);
    assertThat(data.value(rows - 2, 0)).isEqualTo(2f);
  }
}
