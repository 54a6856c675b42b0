package dev.splitwright.check;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatIllegalArgumentException;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.PosixFilePermissions;
import java.time.Duration;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Runs the host C compiler ({@code cc}, gcc on every machine of this project) as a process. */
class CCompilerTest {

  private static final Duration LIMIT = Duration.ofSeconds(60);

  @TempDir Path dir;

  @Test
  void compilesEveryTranslationUnitInOneCompilerRun() throws Exception {
    Path log = dir.resolve("calls.log");
    // A stand-in compiler that records each call and its directory, then hands over to cc.
    Path wrapper =
        script("logging-cc", "echo \"$(pwd) $*\" >> '" + log + "'\nexec cc \"$@\"\n");
    CCompiler cc = CCompiler.find(wrapper.toString(), List.of("-std=c99", "-Os"), LIMIT);

    ObjectFiles objects =
        cc.compileObjects(
            Map.of(
                "b.c", "#include \"shared.h\"\nint twice(int x) { return x * FACTOR; }\n",
                "a.c", "#include \"shared.h\"\nint thrice(int x) { return x * FACTOR + x; }\n",
                "shared.h", "#define FACTOR 2\n"));

    List<String> calls = Files.readAllLines(log);
    assertThat(calls).hasSize(1);
    assertThat(calls.get(0)).endsWith(" -std=c99 -Os -c a.c b.c");
    assertThat(objects.sourceNames()).containsExactly("a.c", "b.c");
    assertThat(objects.elf("a.c").functions()).extracting(ElfSymbol::name).contains("thrice");
    assertThat(objects.elf("b.c").functions()).extracting(ElfSymbol::name).contains("twice");
    assertThat(objects.diagnostics()).isEmpty();
    Path workingDirectory = Path.of(calls.get(0).substring(0, calls.get(0).indexOf(' ')));
    assertThat(workingDirectory).doesNotExist();
  }

  @Test
  void compileErrorReportsTheFirstLineThatSaysError() throws Exception {
    CCompiler cc = CCompiler.find("cc", List.of("-std=c99"), LIMIT);

    assertThatThrownBy(
            () -> cc.compileObjects(Map.of("bad.c", "int f(void) {\n  return 1\n}\n")))
        .isInstanceOfSatisfying(
            CCompileException.class,
            e -> {
              // gcc first names the function ("bad.c: In function 'f':"), then the error.
              assertThat(e.stderr().lines().findFirst().orElseThrow())
                  .isEqualTo("bad.c: In function 'f':");
              assertThat(e.firstErrorLine()).startsWith("bad.c:2:").contains(" error: ");
              assertThat(e.getMessage()).isEqualTo(e.firstErrorLine());
              assertThat(e.command()).isEqualTo("cc -std=c99 -c bad.c");
              assertThat(e.exitCode()).isNotZero();
            });
  }

  @Test
  void firstErrorLineFallsBackToTheFirstLineThenToTheExitStatus() {
    assertThat(CCompileException.firstErrorLine("cc", 1, "\nld: cannot find -lfoo\nmore\n"))
        .isEqualTo("ld: cannot find -lfoo");
    assertThat(CCompileException.firstErrorLine("cc -c a.c", 4, ""))
        .isEqualTo("\"cc -c a.c\" exited with status 4 and wrote nothing to standard error");
  }

  @Test
  void missingCompilerIsReportedAsNotFound() {
    assertThatThrownBy(
            () -> CCompiler.find("splitwright-no-such-cc", List.of(), LIMIT))
        .isInstanceOf(CCompilerNotFoundException.class)
        .hasMessage(
            "C compiler \"splitwright-no-such-cc\" not found: no executable of that name on PATH");
    String missingPath = dir.resolve("bin/cc").toString();
    assertThatThrownBy(() -> CCompiler.find(missingPath, List.of(), LIMIT))
        .isInstanceOf(CCompilerNotFoundException.class)
        .hasMessage(
            "C compiler \"" + missingPath + "\" not found: no executable file at that path");
  }

  @Test
  void versionIsTheFirstLineOfVersionOutput() throws Exception {
    String version = CCompiler.find("gcc", List.of(), LIMIT).version();

    // gcc prints e.g. "gcc (Debian 12.2.0-14) 12.2.0" (from memory).
    assertThat(version).startsWith("gcc").containsPattern("\\d+\\.\\d+").doesNotContain("\n");
  }

  @Test
  void compilerOverItsTimeLimitIsKilledWithTheProcessesItStarted() throws Exception {
    Path pidFile = dir.resolve("child.pid");
    Path slow = script("slow-cc", "sleep 60 &\necho $! > '" + pidFile + "'\nwait\n");
    CCompiler cc = CCompiler.find(slow.toString(), List.of(), Duration.ofMillis(1500));

    long start = System.nanoTime();
    assertThatThrownBy(() -> cc.compileObjects(Map.of("a.c", "int a;\n")))
        .isInstanceOf(ProcessTimeoutException.class)
        .hasMessage(
            "\"" + slow + " -c a.c\" did not finish within 1500 ms and was killed with the"
                + " processes it started");
    assertThat(Duration.ofNanos(System.nanoTime() - start)).isLessThan(Duration.ofSeconds(20));

    long child = Long.parseLong(Files.readString(pidFile).strip());
    assertThat(waitUntilGone(child)).as("sleep started by the compiler, pid %d", child).isTrue();
  }

  @Test
  void rejectsSourceNamesThatAreNotPlainCFiles() throws Exception {
    CCompiler cc = CCompiler.find("cc", List.of(), LIMIT);

    for (String name : List.of("../a.c", "sub/a.c", "-o.c", "a.cpp", "a")) {
      assertThatIllegalArgumentException()
          .isThrownBy(() -> cc.compileObjects(Map.of(name, "int a;\n")))
          .withMessage(
              "source file name \"" + name + "\" must be a plain name ending in .c, .h or .ld");
    }
    assertThatIllegalArgumentException()
        .isThrownBy(() -> cc.compileObjects(Map.of("only.h", "int a;\n")))
        .withMessageStartingWith("sources must include at least one .c file");
  }

  @Test
  void rejectsFlagsThatChooseTheOutput() {
    assertThatIllegalArgumentException()
        .isThrownBy(() -> CCompiler.find("cc", List.of("-O2", "-c"), LIMIT))
        .withMessage("flags must not contain -c: the compile methods choose the output");
  }

  private Path script(String name, String body) throws Exception {
    Path file = dir.resolve(name);
    Files.writeString(file, "#!/bin/sh\n" + body, StandardCharsets.UTF_8);
    Files.setPosixFilePermissions(file, PosixFilePermissions.fromString("rwx------"));
    return file;
  }

  private static boolean waitUntilGone(long pid) throws InterruptedException {
    long deadline = System.nanoTime() + Duration.ofSeconds(10).toNanos();
    while (System.nanoTime() < deadline) {
      if (ProcessHandle.of(pid).map(h -> !h.isAlive()).orElse(true)) {
        return true;
      }
      Thread.sleep(50);
    }
    return false;
  }
}
