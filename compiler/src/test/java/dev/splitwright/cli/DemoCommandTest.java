package dev.splitwright.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import dev.splitwright.demo.DemoData;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.PosixFileAttributeView;
import java.nio.file.attribute.PosixFilePermission;
import java.nio.file.attribute.PosixFilePermissions;
import java.util.List;
import java.util.Set;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** {@code splitwright demo} writes its CSV like every other output: whole, with usual modes. */
class DemoCommandTest {
  @TempDir Path dir;

  @Test
  void writesTheScenarioWithTheUmaskPermissionsAndNoTemporaryFile() throws IOException {
    assumeTrue(posix(), "POSIX permissions");
    Path out = dir.resolve("pump.csv");
    CliRun run = CliRun.of("demo", "--scenario", "pump-vibration", "--rows", "50", "--out",
        out.toString());

    assertThat(run.exitCode()).as(run.err()).isZero();
    assertThat(run.out()).isEqualTo("wrote " + out + "\n");
    Path expected = dir.resolve("expected.csv");
    DemoData.write("pump-vibration", expected, 50, 7);
    assertThat(Files.readString(out)).isEqualTo(Files.readString(expected));
    // Outside reference: a file created the ordinary way gets 0666 less the process's umask
    // (POSIX open(2) with O_CREAT), which is what a later build stage run by another user needs.
    Path reference = Files.createFile(dir.resolve("reference"));
    assertThat(Files.getPosixFilePermissions(out))
        .isEqualTo(Files.getPosixFilePermissions(reference));
    try (Stream<Path> files = Files.list(dir)) {
      assertThat(files.map(p -> p.getFileName().toString()).sorted().toList())
          .isEqualTo(List.of("expected.csv", "pump.csv", "reference"));
    }
  }

  @Test
  void replacingAFileKeepsItsPermissions() throws IOException {
    assumeTrue(posix(), "POSIX permissions");
    Path out = dir.resolve("gesture.csv");
    Files.writeString(out, "old");
    Set<PosixFilePermission> mode = PosixFilePermissions.fromString("rw-r-----");
    Files.setPosixFilePermissions(out, mode);

    CliRun run = CliRun.of("demo", "--scenario", "gesture-band", "--rows", "20", "--out",
        out.toString());

    assertThat(run.exitCode()).as(run.err()).isZero();
    assertThat(Files.readString(out)).isNotEqualTo("old");
    assertThat(Files.getPosixFilePermissions(out)).isEqualTo(mode);
  }

  @Test
  void aFailedWriteLeavesTheOldFileAndNoTemporaryFile() throws IOException {
    Files.writeString(dir.resolve("taken"), "a file, not a directory");

    CliRun run = CliRun.of("demo", "--scenario", "pump-vibration", "--rows", "20", "--out",
        dir.resolve("taken/pump.csv").toString());

    assertThat(run.exitCode()).isEqualTo(ExitCodes.BAD_INPUT);
    assertThat(run.errLines()).hasSize(1);
    assertThat(run.err()).startsWith("error: cannot write ");
    try (Stream<Path> files = Files.list(dir)) {
      assertThat(files.map(p -> p.getFileName().toString()).toList()).containsExactly("taken");
    }
    assertThat(Files.readString(dir.resolve("taken"))).isEqualTo("a file, not a directory");
  }

  private boolean posix() throws IOException {
    return Files.getFileStore(dir).supportsFileAttributeView(PosixFileAttributeView.class);
  }
}
