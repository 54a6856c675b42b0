package dev.splitwright.job;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.attribute.PosixFileAttributeView;
import java.nio.file.attribute.PosixFilePermission;
import java.nio.file.attribute.PosixFilePermissions;
import java.util.Map;
import java.util.Set;
import java.util.concurrent.atomic.AtomicInteger;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/** All or nothing: whichever step fails, the directory ends exactly as it started. */
class OutputFilesTest {
  @TempDir Path dir;

  /** Moves like the real thing, but fails the {@code failing}-th move (1-based). */
  private static OutputFiles.Mover failingMove(int failing, IOException failure) {
    AtomicInteger calls = new AtomicInteger();
    return (temp, target) -> {
      if (calls.incrementAndGet() == failing) {
        throw failure;
      }
      Files.move(temp, target, StandardCopyOption.REPLACE_EXISTING);
    };
  }

  @Test
  void writesEveryFileAndLeavesNoTemporaryFile() throws IOException {
    Files.writeString(dir.resolve("a.txt"), "old a");
    OutputFiles files = new OutputFiles();
    files.add(dir.resolve("a.txt"), "new a");
    files.add(dir.resolve("sub/deeper/b.txt"), "new b");

    files.commit();

    assertThat(AtomicOutputTest.snapshot(dir))
        .isEqualTo(Map.of("a.txt", "new a", "sub/deeper/b.txt", "new b"));
  }

  @Test
  void aFailedSecondMovePutsTheFirstFileBack() throws IOException {
    Files.writeString(dir.resolve("a.txt"), "old a");
    Files.writeString(dir.resolve("b.txt"), "old b");
    OutputFiles files = new OutputFiles(failingMove(2, new IOException("disk full")));
    files.add(dir.resolve("a.txt"), "new a");
    files.add(dir.resolve("b.txt"), "new b");

    assertThatThrownBy(files::commit)
        .isInstanceOf(OutputException.class)
        .hasMessage("cannot write " + dir.resolve("b.txt") + ": disk full; no output was changed;"
            + " check free space and permissions of the output directory");

    assertThat(AtomicOutputTest.snapshot(dir))
        .isEqualTo(Map.of("a.txt", "old a", "b.txt", "old b"));
  }

  @Test
  void aFailedMoveRemovesNewFilesAndTheDirectoriesMadeForThem() throws IOException {
    Files.writeString(dir.resolve("keep.txt"), "keep");
    OutputFiles files = new OutputFiles(failingMove(3, new IOException("disk full")));
    files.add(dir.resolve("new/pkg/A.java"), "a");
    files.add(dir.resolve("A.report.json"), "r");
    files.add(dir.resolve("model.json"), "m");

    assertThatThrownBy(files::commit).isInstanceOf(OutputException.class);

    assertThat(AtomicOutputTest.snapshot(dir)).isEqualTo(Map.of("keep.txt", "keep"));
    assertThat(dir.resolve("new")).doesNotExist();
  }

  @Test
  void aWriteFailureLeavesNoTemporaryFileBehind() throws IOException {
    Files.writeString(dir.resolve("plain"), "a file, not a directory");
    OutputFiles files = new OutputFiles();
    files.add(dir.resolve("made/A.java"), "a");
    files.add(dir.resolve("plain/model.json"), "m");

    assertThatThrownBy(files::commit)
        .isInstanceOf(OutputException.class)
        .hasMessageStartingWith("cannot write " + dir.resolve("plain/model.json") + ": ")
        .hasMessageEndingWith("; no output was changed; check free space and permissions of the"
            + " output directory")
        .message().doesNotContain("Exception").doesNotContain("\n");

    assertThat(AtomicOutputTest.snapshot(dir))
        .isEqualTo(Map.of("plain", "a file, not a directory"));
    assertThat(dir.resolve("made")).doesNotExist();
  }

  @Test
  void aBugDuringTheMovesIsRethrownAfterRollingBack() throws IOException {
    Files.writeString(dir.resolve("a.txt"), "old a");
    AtomicInteger calls = new AtomicInteger();
    OutputFiles files = new OutputFiles((temp, target) -> {
      if (calls.incrementAndGet() == 2) {
        throw new IllegalStateException("bug");
      }
      Files.move(temp, target, StandardCopyOption.REPLACE_EXISTING);
    });
    files.add(dir.resolve("a.txt"), "new a");
    files.add(dir.resolve("b.txt"), "new b");

    assertThatThrownBy(files::commit).isInstanceOf(IllegalStateException.class).hasMessage("bug");

    assertThat(AtomicOutputTest.snapshot(dir)).isEqualTo(Map.of("a.txt", "old a"));
  }

  @Test
  void aTargetThatIsADirectoryFailsBeforeAnythingIsReplaced() throws IOException {
    Files.writeString(dir.resolve("a.txt"), "old a");
    Files.createDirectory(dir.resolve("b.txt"));
    OutputFiles files = new OutputFiles();
    files.add(dir.resolve("a.txt"), "new a");
    files.add(dir.resolve("b.txt"), "new b");

    assertThatThrownBy(files::commit)
        .isInstanceOf(OutputException.class)
        .hasMessageStartingWith("cannot write " + dir.resolve("b.txt") + ": is a directory;");

    assertThat(Files.readString(dir.resolve("a.txt"))).isEqualTo("old a");
    assertThat(Files.isDirectory(dir.resolve("b.txt"))).isTrue();
  }

  @Test
  void temporaryNamesStayShortForLongTargetNames() throws IOException {
    // 250 bytes is legal for the target; a temporary name built from all of it would not be.
    String name = "C".repeat(245) + ".java";
    OutputFiles files = new OutputFiles();
    files.add(dir.resolve(name), "long");

    files.commit();

    assertThat(Files.readString(dir.resolve(name))).isEqualTo("long");
  }

  @Test
  void aNewFileGetsThePermissionsTheUmaskGives() throws IOException {
    assumeTrue(posix(), "POSIX permissions");
    // Outside reference: a file the JVM creates the ordinary way gets 0666 less the process's
    // umask (POSIX open(2) with O_CREAT); an output must get the same, not owner-only 0600.
    Path reference = Files.createFile(dir.resolve("reference.txt"));
    OutputFiles files = new OutputFiles();
    files.add(dir.resolve("new.txt"), "new");
    files.add(dir.resolve("sub/new.txt"), "new in a new directory");

    files.commit();

    assertThat(Files.getPosixFilePermissions(dir.resolve("new.txt")))
        .isEqualTo(Files.getPosixFilePermissions(reference));
    assertThat(Files.getPosixFilePermissions(dir.resolve("sub/new.txt")))
        .isEqualTo(Files.getPosixFilePermissions(reference));
  }

  @ParameterizedTest
  @ValueSource(strings = {"rw-r-----", "rwxr-xr-x", "rw-rw-rw-", "r--r--r--"})
  void aReplacedFileKeepsItsPermissions(String mode) throws IOException {
    assumeTrue(posix(), "POSIX permissions");
    Path target = dir.resolve("out.txt");
    Files.writeString(target, "old");
    Set<PosixFilePermission> before = PosixFilePermissions.fromString(mode);
    Files.setPosixFilePermissions(target, before);
    OutputFiles files = new OutputFiles();
    files.add(target, "new");

    files.commit();

    assertThat(Files.readString(target)).isEqualTo("new");
    assertThat(Files.getPosixFilePermissions(target)).isEqualTo(before);
  }

  @Test
  void contentCanBeWrittenByItsOwnWriter() throws IOException {
    Files.writeString(dir.resolve("data.csv"), "old");
    OutputFiles files = new OutputFiles();
    files.add(dir.resolve("data.csv"), temp -> Files.writeString(temp, "a,b\n1,2\n"));

    files.commit();

    assertThat(AtomicOutputTest.snapshot(dir)).isEqualTo(Map.of("data.csv", "a,b\n1,2\n"));
  }

  private boolean posix() throws IOException {
    return Files.getFileStore(dir).supportsFileAttributeView(PosixFileAttributeView.class);
  }
}
