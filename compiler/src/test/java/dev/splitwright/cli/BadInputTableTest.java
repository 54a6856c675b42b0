package dev.splitwright.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assumptions.assumeFalse;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.PosixFilePermissions;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * The README's table of bad inputs, run through the real entry point {@link Main#run}: each row
 * gives its exit code and, on failure, exactly one stderr line saying what is wrong, where and what
 * to do, with no stack trace, while every file in the case's directory, including a previous good
 * output of the same class, stays byte for byte as it was. Accepted oddities (BOM, CRLF, quoting,
 * text in an undeclared column) must compile and leave that previous output alone too.
 *
 * <p>Loader-level details (exact wording of every message) are in {@code CsvLoaderErrorTest}; this
 * table checks the command line end to end.
 */
class BadInputTableTest {
  private static final String VALID = "a,b,label\n"
      + "1.0,5,x\n2.0,6,x\n3.0,7,x\n4.0,8,y\n5.0,9,y\n6.0,10,y\n7.0,11,x\n8.0,12,y\n";

  /** A directory holding a real, previous good output of class {@code p.C}, made once. */
  private static Path goodOutput;

  @TempDir Path dir;

  @BeforeAll
  static void makeAPreviousGoodOutput(@TempDir Path temp) throws IOException {
    Path csv = Files.writeString(temp.resolve("good.csv"), VALID);
    Path out = temp.resolve("out");
    CliRun run = CliRun.of("compile", "--data", csv.toString(), "--package", "p", "--class", "C",
        "--out", out.toString(), "--max-depth", "3");
    assertThat(run.exitCode()).as(run.err()).isZero();
    assertThat(snapshot(out)).containsOnlyKeys("p/", "p/C.java", "C.report.json", "C.tree.svg");
    goodOutput = out;
  }

  /** Prepares one case's files and adjusts its arguments. */
  @FunctionalInterface
  interface Setup {
    void apply(Path dir, Args args) throws IOException;
  }

  /** The command line of a case: options in a fixed order, each given at most once. */
  static final class Args {
    private final Map<String, String> options = new LinkedHashMap<>();
    private final List<String> flags = new ArrayList<>();

    Args(Path dir) {
      options.put("--data", dir.resolve("t.csv").toString());
      options.put("--package", "p");
      options.put("--class", "C");
      options.put("--out", dir.resolve("out").toString());
      options.put("--max-depth", "3");
    }

    Args set(String option, String value) {
      options.put(option, value);
      return this;
    }

    Args remove(String option) {
      options.remove(option);
      return this;
    }

    Args flag(String flag) {
      flags.add(flag);
      return this;
    }

    String[] toArray() {
      List<String> all = new ArrayList<>(List.of("compile"));
      options.forEach((k, v) -> all.addAll(List.of(k, v)));
      all.addAll(flags);
      return all.toArray(new String[0]);
    }
  }

  /**
   * One row of the table.
   *
   * @param mentions what the single stderr line must contain: what, where and what to do
   */
  record Case(String name, int exitCode, Setup setup, List<String> mentions) {
    @Override
    public String toString() {
      return name;
    }
  }

  private static Case fails(String name, Setup setup, String... mentions) {
    return new Case(name, 2, setup, List.of(mentions));
  }

  /** A case that must compile; it writes class {@code p.Accepted} next to the previous output. */
  private static Case accepted(String name, Setup setup) {
    Setup renamed = (dir, args) -> {
      args.set("--class", "Accepted");
      setup.apply(dir, args);
    };
    return new Case(name, 0, renamed, List.of());
  }

  private static Setup csv(String text) {
    return (dir, args) -> Files.writeString(dir.resolve("t.csv"), text, StandardCharsets.UTF_8);
  }

  private static Setup csv(String text, String option, String value) {
    return (dir, args) -> {
      csv(text).apply(dir, args);
      args.set(option, value);
    };
  }

  /** The members of a model file before its schema; the SHA-256 is a placeholder. */
  private static final String MODEL_HEAD = "{\"format\":\"splitwright-model\",\"version\":2,"
      + "\"trainedOn\":{\"name\":\"t.csv\",\"sha256\":\"" + "0".repeat(64) + "\"},";

  /** A model of {@link #VALID}: a <= 3.5 goes left to x, else right to y. */
  private static final String MODEL = MODEL_HEAD
      + "\"target\":\"label\",\"classes\":[\"x\",\"y\"],\"features\":["
      + "{\"name\":\"a\",\"kind\":\"numeric\"},{\"name\":\"b\",\"kind\":\"numeric\"}],"
      + "\"nodes\":[{\"feature\":0,\"threshold\":\"3.5\",\"missing\":\"left\",\"left\":1,"
      + "\"right\":2,\"counts\":[4,4]},{\"predict\":0,\"counts\":[3,0]},"
      + "{\"predict\":1,\"counts\":[1,4]}]}";

  private static final String CATEGORIES_3 = categoriesCsv(3);
  private static final String CATEGORIES_70 = categoriesCsv(70);

  /** One categorical column "c" with values c00, c01, ... (codes in that order). */
  private static String categoriesCsv(int k) {
    StringBuilder text = new StringBuilder("c,label\n");
    for (int i = 0; i < Math.max(k, 4); i++) {
      text.append(String.format(Locale.ROOT, "c%02d,%s\n", i % k, i % 2 == 0 ? "x" : "y"));
    }
    return text.toString();
  }

  /** A model of {@link #categoriesCsv}: code {@code code} goes left. */
  private static String categoricalModel(int k, int code) {
    List<String> names = new ArrayList<>();
    for (int i = 0; i < k; i++) {
      names.add(String.format(Locale.ROOT, "\"c%02d\"", i));
    }
    return MODEL_HEAD + "\"target\":\"label\","
        + "\"classes\":[\"x\",\"y\"],\"features\":[{\"name\":\"c\",\"kind\":"
        + "\"categorical\",\"categories\":[" + String.join(",", names) + "]}],\"nodes\":["
        + "{\"feature\":0,\"leftCodes\":[" + code + "],\"missing\":\"right\",\"left\":1,"
        + "\"right\":2,\"counts\":[2,2]},{\"predict\":0,\"counts\":[1,1]},"
        + "{\"predict\":1,\"counts\":[1,1]}]}";
  }

  /** A model of {@link #VALID}: {@code depth} splits on a in a chain, each with a leaf right. */
  private static String chain(int depth) {
    StringBuilder nodes = new StringBuilder();
    for (int level = 0; level < depth; level++) {
      nodes.append("{\"feature\":0,\"threshold\":\"").append(level).append(".5\",")
          .append("\"missing\":\"left\",\"left\":").append(2 * level + 2)
          .append(",\"right\":").append(2 * level + 1).append(",\"counts\":[1,")
          .append(depth - level).append("]},{\"predict\":1,\"counts\":[0,1]},");
    }
    return MODEL.substring(0, MODEL.indexOf("\"nodes\"")) + "\"nodes\":[" + nodes
        + "{\"predict\":0,\"counts\":[1,0]}]}";
  }

  private static Setup model(String csvText, String json) {
    return (dir, args) -> {
      csv(csvText).apply(dir, args);
      args.set("--model", Files.writeString(dir.resolve("m.json"), json).toString());
    };
  }

  private static Setup validWith(String option, String value) {
    return csv(VALID, option, value);
  }

  private static Setup validWithout(String option) {
    return (dir, args) -> {
      csv(VALID).apply(dir, args);
      args.remove(option);
    };
  }

  static Stream<Case> table() {
    return Stream.of(
        // Files that cannot be read.
        fails("missing file", (dir, args) -> { }, "t.csv", "no such file", "check the path"),
        fails("directory instead of file",
            (dir, args) -> Files.createDirectory(dir.resolve("t.csv")),
            "t.csv", "is a directory, not a CSV file", "give the path of a file"),
        fails("unreadable file (no read permission)", (dir, args) -> {
          Path file = Files.writeString(dir.resolve("t.csv"), VALID);
          Files.setPosixFilePermissions(file, PosixFilePermissions.fromString("---------"));
          assumeFalse(Files.isReadable(file), "running as root, where file permissions do not"
              + " stop reading; the next row covers an unreadable file another way");
        }, "t.csv", "permission denied", "make the file readable"),
        fails("unreadable file (every read fails)", (dir, args) -> {
          // Linux: reading a process's own memory at address 0 fails with EIO, even for root.
          Path mem = Path.of("/proc/self/mem");
          assumeTrue(Files.exists(mem), "needs Linux /proc");
          args.set("--data", mem.toString());
        }, "/proc/self/mem", "cannot read the file: Input/output error",
            "check that the path names a readable regular file"),
        // Files with the wrong shape.
        fails("empty file", csv(""), "t.csv: the file is empty", "start the file with a header"),
        fails("header only", csv("a,b,label\n"), "t.csv: header only, no data rows",
            "add data rows below the header row"),
        fails("duplicate column names", csv("a,b,a,label\n1,2,3,x\n4,5,6,y\n"), "t.csv:1:3",
            "duplicate column name 'a' (also column 1)", "give every column a distinct name"),
        fails("blank column name", csv("a, ,label\n1,2,x\n3,4,y\n"), "t.csv:1:2",
            "blank column name", "give every column a name"),
        fails("overlong column name", csv("a," + "b".repeat(1025) + ",label\n1,2,x\n3,4,y\n"),
            "t.csv:1:2", "has 1025 characters, more than the 1024 allowed",
            "check that the first row is the header row"),
        fails("--target not in header", validWith("--target", "species"), "option --target",
            "t.csv has no column 'species'", "use one of a, b, label"),
        fails("target column entirely empty", csv("a,b,label\n1,2,\n3,4,\n"), "t.csv:2:3",
            "missing class label (column 'label')", "give every row a label"),
        fails("only one class present", csv("a,b,label\n1,2,x\n3,4,x\n5,6,x\n"), "t.csv",
            "all 3 rows have the same class 'x' in target column 'label'",
            "needs at least two classes", "check --target"),
        accepted("a class with a single row (default split)",
            csv("a,b,label\n1,2,x\n3,4,x\n5,6,x\n7,8,y\n")),
        accepted("a class with a single row (train fraction below the others)",
            csv("a,b,label\n1,2,x\n7,8,y\n", "--split", "0.2,0.4,0.4")),
        fails("ragged row (too few cells)", csv("a,b,label\n1,2,x\n3,y\n"), "t.csv:3",
            "row has 2 cells but the header has 3 columns", "one cell per column"),
        fails("ragged row (too many cells)", csv("a,b,label\n1,2,x\n3,4,y,5\n"), "t.csv:3",
            "row has 4 cells but the header has 3 columns", "one cell per column"),
        // Cells.
        fails("non-numeric cell in a --numeric column",
            csv("a,b,label\n1,2,x\n3,n/a,y\n", "--numeric", "b"), "t.csv:3:2",
            "'n/a' is not a number (column 'b')", "do not declare the column numeric"),
        accepted("non-numeric cell in an undeclared column (becomes categorical)",
            csv("a,b,label\n1,low,x\n2,high,y\n3,low,x\n4,high,y\n5,mid,x\n6,mid,y\n")),
        fails("NaN text in a numeric cell", csv("a,b,label\n1,2,x\n3,4,y\nNaN,5,x\n"),
            "t.csv:4:1", "'NaN' is not a reading but a logging fault marker (column 'a')",
            "declare 'NaN' a missing-value token (--missing)"),
        fails("Infinity text in a numeric cell", csv("a,b,label\n1,-Infinity,x\n3,4,y\n"),
            "t.csv:2:2", "'-Infinity' is not a reading", "export missing readings as empty"),
        accepted("NaN text declared missing with --missing",
            csv("a,b,label\n1,2,x\n3,4,y\nNaN,5,x\n6,NaN,y\n", "--missing", "NaN")),
        fails("hexadecimal number", csv("a,b,label\n0x1p3,2,x\n3,4,y\n"), "t.csv:2:1",
            "'0x1p3' is not a plain decimal number (column 'a')",
            "write numbers as plain decimals"),
        fails("number beyond float32 range", csv("a,b,label\n1,2,x\n3,-1e39,y\n"), "t.csv:3:2",
            "'-1e39' is too large for a 32-bit float", "rescale the column or fix the cell",
            "not clamped"),
        fails("overlong class label", csv("a,label\n1,x\n2," + "y".repeat(2000) + "\n"),
            "t.csv:3:2", "class label 'yyy", "has 2000 characters",
            "check that --target names the class-label column"),
        // Encodings and quoting.
        accepted("UTF-8 byte order mark", csv("\uFEFFlabel,a,b\nx,1,2\ny,3,4\nx,1,3\ny,4,4\n",
            "--target", "label")),
        accepted("CRLF line ends", csv(VALID.replace("\n", "\r\n"))),
        accepted("no line break after the last row", csv(VALID.strip())),
        accepted("quoted fields with commas and newlines",
            csv("a,note,label\n1,\"left, low\",\"north, east\"\n2,\"two\nlines\",south\n"
                + "3,\"left, low\",\"north, east\"\n4,\"two\nlines\",south\n")),
        fails("unterminated quote", csv("a,label\n1,x\n\"2,y\n3,z\n"), "t.csv:3",
            "a quoted cell starting in this row is never closed", "close the quote"),
        fails("text after a closing quote", csv("a,label\n\"1\"2,x\n3,y\n"), "t.csv:2",
            "text follows a closing quote in this row", "put the whole cell inside the quotes"),
        fails("non-UTF-8 bytes", (dir, args) -> Files.write(dir.resolve("t.csv"),
            bytes("a,label\n1,x\n2,caf", (byte) 0xE9, "\n")), "t.csv:3",
            "invalid UTF-8 byte 0xE9 at byte offset 17", "save the file as UTF-8"),
        fails("more than 65535 distinct labels", (dir, args) -> {
          StringBuilder text = new StringBuilder("a,label\n");
          for (int i = 0; i <= 65_535; i++) {
            text.append(i % 7).append(",c").append(i).append('\n');
          }
          Files.writeString(dir.resolve("t.csv"), text);
        }, "t.csv:65537:2", "more than 65535 distinct class labels",
            "choose a target column with fewer classes"),
        fails("more than 65535 distinct values in a categorical column", (dir, args) -> {
          StringBuilder text = new StringBuilder("id,a,label\n");
          for (int i = 0; i <= 65_535; i++) {
            text.append("row").append(i).append(',').append(i % 7).append(i % 2 == 0 ? ",x\n"
                : ",y\n");
          }
          Files.writeString(dir.resolve("t.csv"), text);
        }, "t.csv:65537:1", "more than 65535 distinct values in a categorical column (column 'id')",
            "drop identifier-like columns"),
        // Saved models.
        fails("--model file that is not JSON", (dir, args) -> {
          csv(VALID).apply(dir, args);
          args.set("--model", Files.writeString(dir.resolve("m.json"), "{\"format\":").toString());
        }, "m.json:1:", "not a valid Splitwright model file",
            "pass a file written by --save-model"),
        fails("--model file of another format", model(VALID, "{}"),
            "m.json: /format: expected a string but found nothing",
            "pass a file written by --save-model"),
        // Version 1 files did not record their training data (issue 12): refused, saying so.
        fails("--model file of format version 1",
            model(VALID, "{\"format\":\"splitwright-model\",\"version\":1,"
                + MODEL.substring(MODEL_HEAD.length())),
            "m.json: /version: expected version 2 (version 1 files do not record the data the "
                + "model was trained on) but found version 1",
            "train it again with compile --save-model, which records its training data"),
        // Ensembles (version 3, issue 16): --model reads them (ModelFile.loadAny) and emits them.
        accepted("--model file of an ensemble",
            model(VALID, MODEL.replace("\"version\":2,", "\"version\":3,\"kind\":\"forest\",")
                .replace("\"nodes\":[", "\"trees\":[{\"nodes\":[").replaceFirst("}$", "}]}"))),
        // Saved models are checked in full before use (issue 11): the place is a JSON Pointer.
        accepted("--model file written by hand for the data", model(VALID, MODEL)),
        fails("--model split on a feature the data lacks",
            model(VALID, MODEL.replace("\"feature\":0", "\"feature\":2")),
            "m.json: /nodes/0/feature: expected an integer from 0 to 1 but found 2",
            "pass a file written by --save-model"),
        fails("--model leaf predicting a class index the model lacks",
            model(VALID, MODEL.replace("\"predict\":1", "\"predict\":2")),
            "m.json: /nodes/2/predict: expected an integer from 0 to 1 but found 2"),
        fails("--model NaN threshold", model(VALID, MODEL.replace("3.5", "NaN")),
            "m.json: /nodes/0/threshold: expected a decimal number", "found 'NaN'"),
        fails("--model counts that do not add up",
            model(VALID, MODEL.replace("[1,4]", "[1,5]")),
            "m.json: /nodes/0/counts/1: expected 5, the sum of its children's counts"),
        fails("--model member this format does not have",
            model(VALID, MODEL.replace("{\"predict\":0,", "{\"weight\":2,\"predict\":0,")),
            "m.json: /nodes/1/weight: expected only the members"),
        accepted("--model categorical split (3 categories)", model(CATEGORIES_3,
            categoricalModel(3, 2))),
        // Before: 1L << 3 set a bit no category has; the emitted code disagreed with the model.
        fails("--model category code 3 of 3 categories",
            model(CATEGORIES_3, categoricalModel(3, 3)),
            "m.json: /nodes/0/leftCodes/0: expected an integer from 0 to 2 but found 3"),
        fails("--model negative category code",
            model(CATEGORIES_3, categoricalModel(3, -1)),
            "m.json: /nodes/0/leftCodes/0: expected an integer from 0 to 2 but found -1"),
        accepted("--model categorical split (70 categories)", model(CATEGORIES_70,
            categoricalModel(70, 69))),
        // Before: the packer threw for a code past 64 (exit 3).
        fails("--model category code 70 of 70 categories",
            model(CATEGORIES_70, categoricalModel(70, 70)),
            "m.json: /nodes/0/leftCodes/0: expected an integer from 0 to 69 but found 70"),
        accepted("--model tree at the depth cap (100)", model(VALID, chain(100))),
        fails("--model tree one level deeper than the cap", model(VALID, chain(101)),
            "m.json: /nodes/201: expected a tree at most 100 levels deep but found a node at "
                + "depth 101"),
        // Before: a StackOverflowError (exit 3).
        fails("--model tree 5,000 levels deep", model(VALID, chain(5_000)),
            "m.json: /nodes/201: expected a tree at most 100 levels deep"),
        fails("--model JSON nested 5,000 levels deep", model(VALID,
            MODEL.replace("\"nodes\"", "\"training\":{\"x\":" + "[".repeat(5_000)
                + "]".repeat(5_000) + "},\"nodes\"")),
            "m.json:1:", "JSON nested more than 32 levels deep",
            "pass a file written by --save-model"),
        // Output locations.
        fails("output path is an existing file", (dir, args) -> {
          csv(VALID).apply(dir, args);
          Files.writeString(dir.resolve("out.txt"), "keep me");
          args.set("--out", dir.resolve("out.txt").toString());
        }, "option --out", "out.txt is a file, not a directory", "give a directory path"),
        fails("output directory not creatable (below a regular file)", (dir, args) -> {
          csv(VALID).apply(dir, args);
          Files.writeString(dir.resolve("plain"), "keep me");
          args.set("--out", dir.resolve("plain/out").toString());
        }, "option --out", "cannot write", "plain is a file, not a directory",
            "choose a path that does not pass through a file"),
        fails("output directory not writable (permissions)", (dir, args) -> {
          csv(VALID).apply(dir, args);
          Path locked = Files.createDirectory(dir.resolve("locked"));
          Files.setPosixFilePermissions(locked, PosixFilePermissions.fromString("r-xr-xr-x"));
          assumeFalse(Files.isWritable(locked), "running as root, where permissions do not stop"
              + " writing; the row above covers an output directory that cannot be written");
          args.set("--out", locked.resolve("out").toString());
        }, "option --out", "is not writable", "choose a directory you may write to"),
        fails("an output file's name is taken by a directory", (dir, args) -> {
          csv(VALID).apply(dir, args);
          Files.delete(dir.resolve("out/C.report.json"));
          Files.createDirectory(dir.resolve("out/C.report.json"));
        }, "option --out", "C.report.json: a directory of that name exists",
            "remove or rename that directory"),
        fails("--save-model below a regular file", (dir, args) -> {
          csv(VALID).apply(dir, args);
          Files.writeString(dir.resolve("plain"), "keep me");
          args.set("--save-model", dir.resolve("plain/model.json").toString());
        }, "option --save-model", "plain is a file, not a directory"),
        // Java names.
        fails("--class 3D", validWith("--class", "3D"), "option --class",
            "'3D' is not a Java identifier", "choose a name such as"),
        fails("--class int (a keyword)", validWith("--class", "int"), "option --class",
            "'int' is a reserved word of Java", "choose a name such as"),
        fails("--class var (restricted)", validWith("--class", "var"), "option --class",
            "'var' cannot name a class in Java 17", "choose a name such as"),
        fails("--class String (hides java.lang)", validWith("--class", "String"),
            "option --class", "would hide java.lang.String", "choose a name such as"),
        fails("--class with 201 bytes", validWith("--class", "C".repeat(201)), "option --class",
            "201 bytes long, more than 200", "choose a shorter name"),
        fails("--package a..b", validWith("--package", "a..b"), "option --package",
            "'a..b' has an empty part", "dot-separated identifiers such as com.example.pump"),
        fails("--package com.class (a keyword)", validWith("--package", "com.class"),
            "option --package", "contains 'class', a reserved word of Java",
            "rename that part"),
        fails("--package com.3d", validWith("--package", "com.3d"), "option --package",
            "'3d', which is not a Java identifier", "dot-separated identifiers"),
        fails("--package java.pump (reserved by the JVM)", validWith("--package", "java.pump"),
            "option --package", "under 'java'", "use your own package"),
        // Contradictory or out-of-range options.
        fails("--max-depth 0", validWith("--max-depth", "0"), "option '--max-depth'",
            "must be at least 1, but it is 0", "--help"),
        fails("--max-depth 101", validWith("--max-depth", "101"), "option '--max-depth'",
            "must be at most 100, but it is 101", "--help"),
        fails("--min-leaf 0", validWith("--min-leaf", "0"), "option '--min-leaf'",
            "must be at least 1, but it is 0", "--help"),
        fails("--max-leaves 1", validWith("--max-leaves", "1"), "option '--max-leaves'",
            "must be at least 2, but it is 1", "--help"),
        fails("split fractions not summing to 1", validWith("--split", "0.5,0.5,0.5"),
            "option '--split'", "fractions must sum to 1, but '0.5,0.5,0.5' sums to 1.5",
            "e.g. 0.6,0.2,0.2"),
        fails("--split 0,0.5,0.5", validWith("--split", "0,0.5,0.5"), "option '--split'",
            "gives the train part 0", "e.g. 0.6,0.2,0.2"),
        fails("--split with two parts", validWith("--split", "0.6,0.4"), "option '--split'",
            "needs three fractions", "e.g. 0.6,0.2,0.2"),
        fails("--impurity unknown", validWith("--impurity", "variance"), "option '--impurity'",
            "must be gini or entropy, but it is 'variance'", "--help"),
        fails("--max-depth not a number", validWith("--max-depth", "deep"), "'--max-depth'",
            "'deep' is not an int", "--help"),
        fails("unknown option", (dir, args) -> {
          csv(VALID).apply(dir, args);
          args.flag("--colour");
        }, "Unknown option: '--colour'", "--help"),
        fails("missing required option", validWithout("--class"),
            "Missing required option: '--class=NAME'", "--help"));
  }

  @ParameterizedTest(name = "{0}")
  @MethodSource("table")
  void behavesAsTheTableSays(Case c) throws IOException {
    Path out = dir.resolve("out");
    restore(out, goodOutput);
    Args args = new Args(dir);
    c.setup().apply(dir, args);
    Map<String, String> before = snapshot(dir);

    CliRun run = CliRun.of(args.toArray());

    assertThat(run.exitCode()).as(run.err()).isEqualTo(c.exitCode());
    if (c.exitCode() == 0) {
      assertAcceptedAndPreviousOutputKept(run, before);
      return;
    }
    assertThat(run.out()).isEmpty();
    assertThat(run.errLines()).as(run.err()).hasSize(1);
    String line = run.errLines()[0];
    assertThat(line).contains(c.mentions());
    assertNoStackTrace(run.err());
    assertSameFiles(snapshot(dir), before);
  }

  private void assertAcceptedAndPreviousOutputKept(CliRun run, Map<String, String> before)
      throws IOException {
    assertThat(run.err()).isEmpty();
    Map<String, String> after = snapshot(dir);
    Map<String, String> kept = new TreeMap<>(after);
    assertThat(kept.remove("out/p/Accepted.java")).isNotNull();
    assertThat(kept.remove("out/Accepted.report.json")).isNotNull();
    assertThat(kept.remove("out/Accepted.tree.svg")).isNotNull();
    assertSameFiles(kept, before);
    assertThat(Files.readString(dir.resolve("out/p/Accepted.java")))
        .contains("public final class Accepted");
    assertThat(temporaryFiles(dir)).isEmpty();
  }

  @Test
  void debugShowsTheStackTraceThatIsOtherwiseHidden() {
    CliRun run = CliRun.of("compile", "--data", dir.resolve("absent.csv").toString(),
        "--class", "C", "--out", dir.resolve("out").toString(), "--debug");

    assertThat(run.exitCode()).isEqualTo(2);
    assertThat(run.errLines()[0]).contains("absent.csv: no such file; check the path");
    assertThat(run.err()).contains("\tat ").contains("InputException");
  }

  @Test
  void textInAnUndeclaredColumnIsReadAsCategories() throws IOException {
    Path csv = Files.writeString(dir.resolve("t.csv"),
        "a,b,label\n1,low,x\n2,high,y\n3,low,x\n4,high,y\n5,mid,x\n6,mid,y\n");

    CliRun run = CliRun.of("compile", "--data", csv.toString(), "--class", "C", "--out",
        dir.resolve("out").toString());

    assertThat(run.exitCode()).as(run.err()).isZero();
    assertThat(Files.readString(dir.resolve("out/C.java")))
        .contains("<li>b (categorical codes: 0 = high, 1 = low, 2 = mid)</li>");
  }

  @Test
  void quotedCommasAndNewlinesSurviveIntoLabelsAndCategories() throws IOException {
    Path csv = Files.writeString(dir.resolve("t.csv"),
        "a,note,label\n1,\"left, low\",\"north, east\"\n2,\"two\nlines\",south\n"
            + "3,\"left, low\",\"north, east\"\n4,\"two\nlines\",south\n");

    CliRun run = CliRun.of("compile", "--data", csv.toString(), "--class", "C", "--out",
        dir.resolve("out").toString());

    assertThat(run.exitCode()).as(run.err()).isZero();
    String source = Files.readString(dir.resolve("out/C.java"));
    assertThat(source).contains("\"north, east\"").contains("left, low");
  }

  @Test
  void aByteOrderMarkIsNotPartOfTheFirstColumnName() throws IOException {
    Path csv = Files.writeString(dir.resolve("t.csv"), "\uFEFFlabel,a,b\nx,1,2\ny,3,4\n");

    CliRun run = CliRun.of("compile", "--data", csv.toString(), "--target", "label", "--class",
        "C", "--out", dir.resolve("out").toString());

    assertThat(run.exitCode()).as(run.err()).isZero();
    assertThat(Files.readString(dir.resolve("out/C.java"))).contains("for label, generated");
  }

  @Test
  void aClassWithOneRowIsTrainedOnEvenWhenTheTrainFractionIsSmallest() throws IOException {
    Path csv = Files.writeString(dir.resolve("t.csv"), "a,b,label\n1,2,x\n7,8,y\n");

    CliRun run = CliRun.of("compile", "--data", csv.toString(), "--class", "C", "--out",
        dir.resolve("out").toString(), "--split", "0.2,0.4,0.4");

    // Before the fix, both single rows went to validation and test: nothing to train on, exit 3.
    assertThat(run.exitCode()).as(run.err()).isZero();
    assertThat(run.out()).contains("train      rows     2");
  }

  static void assertNoStackTrace(String err) {
    assertThat(err).doesNotContain("\tat ").doesNotContain("Exception")
        .doesNotContainPattern("[a-z]Error\\b");
  }

  static void assertSameFiles(Map<String, String> actual, Map<String, String> expected) {
    assertThat(actual).containsExactlyEntriesOf(expected);
  }

  /**
   * Every file and directory below {@code root}, by relative path with '/' (directories end in
   * '/'), and for files their size and SHA-256: equal snapshots mean byte-identical trees.
   */
  static Map<String, String> snapshot(Path root) throws IOException {
    Map<String, String> files = new TreeMap<>();
    try (Stream<Path> all = Files.walk(root)) {
      for (Path p : (Iterable<Path>) all::iterator) {
        String name = root.relativize(p).toString().replace('\\', '/');
        if (Files.isRegularFile(p)) {
          files.put(name, Files.isReadable(p) ? digest(Files.readAllBytes(p)) : "unreadable");
        } else if (Files.isDirectory(p) && !p.equals(root)) {
          files.put(name + "/", "directory");
        }
      }
    }
    return files;
  }

  private static String digest(byte[] bytes) {
    try {
      return bytes.length + " bytes, SHA-256 "
          + HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(bytes));
    } catch (NoSuchAlgorithmException e) {
      throw new IllegalStateException(e);
    }
  }

  static List<Path> temporaryFiles(Path root) throws IOException {
    try (Stream<Path> all = Files.walk(root)) {
      return all.filter(p -> p.getFileName().toString().endsWith(".tmp")).toList();
    }
  }

  private static void restore(Path out, Path from) throws IOException {
    for (String name : List.of("p/C.java", "C.report.json", "C.tree.svg")) {
      Files.createDirectories(out.resolve(name).getParent());
      Files.copy(from.resolve(name), out.resolve(name));
    }
  }

  private static byte[] bytes(String before, byte raw, String after) {
    ByteArrayOutputStream out = new ByteArrayOutputStream();
    out.writeBytes(before.getBytes(StandardCharsets.UTF_8));
    out.write(raw);
    out.writeBytes(after.getBytes(StandardCharsets.UTF_8));
    return out.toByteArray();
  }
}
