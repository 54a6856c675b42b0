package dev.splitwright.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.splitwright.check.CompiledClasses;
import dev.splitwright.check.DexFile;
import dev.splitwright.check.Dexer;
import dev.splitwright.demo.DemoFiles;
import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.zip.Adler32;
import javax.tools.ToolProvider;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** DEX sizes through the real command line: {@code --dex-size}, {@code --budget-unit dex}. */
class DexCommandTest {
  private static final ObjectMapper JSON = new ObjectMapper();
  private static final String CLASS = "demo.dex.Fit";
  private static final String DESCRIPTOR = "Ldemo/dex/Fit;";

  private static List<String> pumpArgs(Path out, String... extra) {
    List<String> args = new ArrayList<>(List.of("compile", "--data", DemoFiles.pump().toString(),
        "--target", "state", "--seed", "7", "--package", "demo.dex", "--class", "Fit", "--out",
        out.toString()));
    args.addAll(List.of(extra));
    return args;
  }

  private static CliRun run(List<String> args) {
    return CliRun.of(args.toArray(new String[0]));
  }

  @Test
  void reportedDexIsTheDalvikFileD8WritesForTheClass(@TempDir Path dir) throws Exception {
    Path out = dir.resolve("out");
    CliRun run = run(pumpArgs(out, "--max-depth", "4", "--dex-size"));
    assertThat(run.exitCode()).as(run.err()).isZero();
    JsonNode report = JSON.readTree(out.resolve("Fit.report.json").toFile());
    int reported = report.get("dexBytes").asInt();
    assertThat(report.get("dexMinApi").asInt()).isEqualTo(24);
    assertThat(run.out()).contains(", DEX " + reported + " bytes at min-api 24 (an empty class "
        + report.get("dexBytesEmptyClass").asInt() + ", the classifier "
        + report.get("dexBytesOverEmptyClass").asInt() + " more)");

    // The written source, compiled by the system javac and dexed again here.
    byte[] dex = dexOnDisk(out.resolve("demo/dex/Fit.java"), dir.resolve("javac"), 24);
    ByteBuffer header = ByteBuffer.wrap(dex).order(ByteOrder.LITTLE_ENDIAN);
    // Dalvik executable format (AOSP source.android.com, "Dalvik executable format"), header_item:
    // magic "dex\n" then a three-digit version "03x" and a NUL.
    assertThat(Arrays.copyOfRange(dex, 0, 8)).satisfies(magic -> {
      assertThat(new String(magic, 0, 6, StandardCharsets.US_ASCII)).isEqualTo("dex\n03");
      assertThat((char) magic[6]).isBetween('5', '9');
      assertThat(magic[7]).isZero();
    });
    // file_size, uint at 0x20: the whole file, which is what the report gives.
    assertThat(header.getInt(0x20)).isEqualTo(dex.length).isEqualTo(reported);
    // checksum, uint at 8: Adler-32 of the file after the magic and the checksum (offset 12 on).
    Adler32 adler = new Adler32();
    adler.update(dex, 12, dex.length - 12);
    assertThat(header.getInt(8) & 0xFFFF_FFFFL).isEqualTo(adler.getValue());
    // signature, ubyte[20] at 12: SHA-1 of the file after magic, checksum and signature (32 on).
    assertThat(Arrays.copyOfRange(dex, 12, 32)).isEqualTo(sha1(dex, 32));
    // class_defs_size at 0x60: one class, whose descriptor is the emitted class's.
    assertThat(header.getInt(0x60)).isEqualTo(1);
    assertThat(classDescriptor(header)).isEqualTo(DESCRIPTOR);
    // The project's own parser agrees.
    DexFile parsed = DexFile.parse(dex);
    assertThat(parsed.verifyChecksum()).isTrue();
    assertThat(parsed.verifySignature()).isTrue();
    assertThat(parsed.classDescriptors()).containsExactly(DESCRIPTOR);

    int empty = Dexer.forMinApi(24).emptyClassSize(CLASS);
    assertThat(report.get("dexBytesEmptyClass").asInt()).isEqualTo(empty).isLessThan(reported);
    assertThat(report.get("dexBytesOverEmptyClass").asInt()).isEqualTo(reported - empty);
  }

  @Test
  void budgetSearchMeasuresEveryCandidateInDexBytes(@TempDir Path dir) throws Exception {
    Path out = dir.resolve("out");
    CliRun run = run(pumpArgs(out, "--budget", "2KiB", "--budget-unit", "dex", "--quiet"));
    assertThat(run.exitCode()).as(run.err()).isZero();
    JsonNode report = JSON.readTree(out.resolve("Fit.report.json").toFile());
    JsonNode selection = report.get("selection");
    assertThat(selection.get("budgetUnit").asText()).isEqualTo("dex");
    int dexed = dexOnDisk(out.resolve("demo/dex/Fit.java"), dir.resolve("javac"), 24).length;
    int chosen = selection.get("chosen").get("size").asInt();
    assertThat(dexed).isLessThanOrEqualTo(2048).isEqualTo(chosen)
        .isEqualTo(report.get("dexBytes").asInt());

    // The frontier is in DEX bytes: the chosen point weighs what the written class dexes to (no
    // refit, so the candidate is the emitted tree), none is below an empty class's DEX file, and
    // the class-file figure of the same class differs.
    List<JsonNode> frontier = new ArrayList<>();
    selection.get("frontier").forEach(frontier::add);
    assertThat(frontier).filteredOn(p -> p.get("chosen").asBoolean()).singleElement()
        .satisfies(p -> assertThat(p.get("size").asInt()).isEqualTo(dexed));
    int empty = report.get("dexBytesEmptyClass").asInt();
    assertThat(frontier).allSatisfy(p -> assertThat(p.get("size").asInt()).isGreaterThan(empty));
    assertThat(selection.get("smallestSize").asInt())
        .isEqualTo(frontier.get(0).get("size").asInt());
    assertThat(report.get("classFileBytes").asInt()).isNotEqualTo(dexed);
    assertThat(Files.readString(out.resolve("Fit.frontier.svg"))).contains("DEX size");
  }

  @Test
  void tooSmallDexBudgetNamesTheLeastDexSize(@TempDir Path dir) throws Exception {
    Path out = dir.resolve("out");
    CliRun run = run(pumpArgs(out, "--budget", "300", "--budget-unit", "dex", "--max-depth",
        "2"));
    assertThat(run.exitCode()).isEqualTo(2);
    Matcher m = Pattern.compile("error: option --budget: 300 bytes is too small: the smallest "
        + "classifier for this data \\(1 leaf\\) has a DEX size of (\\d+) bytes; give --budget "
        + "(\\d+) or more").matcher(run.err().strip());
    assertThat(m.lookingAt()).as(run.err()).isTrue();
    assertThat(m.group(1)).isEqualTo(m.group(2));
    assertThat(Integer.parseInt(m.group(1))).isGreaterThan(Dexer.forMinApi(24)
        .emptyClassSize(CLASS));
    assertThat(out).doesNotExist();
  }

  @Test
  void minApiOutsideD8sRangeOrWithoutDexIsRefused(@TempDir Path dir) {
    for (List<String> extra : List.of(List.of("--dex-size", "--min-api", "0"),
        List.of("--dex-size", "--min-api", "36"),
        List.of("--budget", "4KiB", "--budget-unit", "dex", "--min-api", "99"),
        List.of("--min-api", "26"))) {
      CliRun run = run(pumpArgs(dir.resolve("out"), extra.toArray(new String[0])));
      assertThat(run.exitCode()).as("%s", extra).isEqualTo(2);
      assertThat(run.errLines()[0]).as("%s", extra).contains("--min-api")
          .doesNotContain("Exception");
      assertThat(dir.resolve("out")).doesNotExist();
    }
  }

  /** Compiles {@code source} with the system javac and dexes its class with D8. */
  static byte[] dexOnDisk(Path source, Path dir, int minApi) throws IOException {
    Path classes = dir.resolve("classes");
    int status = ToolProvider.getSystemJavaCompiler().run(null, null, null, "--release", "17",
        "-encoding", "UTF-8", "-d", classes.toString(), source.toString());
    assertThat(status).isZero();
    byte[] classFile = Files.readAllBytes(classes.resolve("demo/dex/Fit.class"));
    return Dexer.forMinApi(minApi).dex(CompiledClasses.of(Map.of(CLASS, classFile)))
        .bytes(DESCRIPTOR);
  }

  private static byte[] sha1(byte[] bytes, int from) throws NoSuchAlgorithmException {
    MessageDigest sha1 = MessageDigest.getInstance("SHA-1");
    sha1.update(bytes, from, bytes.length - from);
    return sha1.digest();
  }

  /**
   * The descriptor of the first class_def, followed by hand through the format's tables:
   * class_defs_off (0x64) gives class_idx, type_ids_off (0x44) its descriptor_idx, string_ids_off
   * (0x3C) its string_data_off, and string data is a ULEB128 length in UTF-16 units, then MUTF-8.
   */
  private static String classDescriptor(ByteBuffer dex) {
    int classIdx = dex.getInt(dex.getInt(0x64));
    int descriptorIdx = dex.getInt(dex.getInt(0x44) + 4 * classIdx);
    int at = dex.getInt(dex.getInt(0x3C) + 4 * descriptorIdx);
    while ((dex.get(at) & 0x80) != 0) {
      at++;
    }
    at++;
    StringBuilder text = new StringBuilder();
    for (byte b = dex.get(at); b != 0; b = dex.get(++at)) {
      text.append((char) b); // the descriptor is ASCII
    }
    return text.toString();
  }
}
