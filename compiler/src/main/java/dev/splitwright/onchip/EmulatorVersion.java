package dev.splitwright.onchip;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.time.Duration;
import java.util.List;
import java.util.concurrent.TimeUnit;

/** The first line an emulator prints for {@code --version}, e.g. {@code QEMU emulator ...}. */
final class EmulatorVersion {
  private EmulatorVersion() {}

  static String of(Path emulator, Duration limit) throws OnChipProofException {
    ProcessBuilder builder = new ProcessBuilder(List.of(emulator.toString(), "--version"))
        .redirectErrorStream(true);
    builder.environment().put("LC_ALL", "C");
    try {
      Process process = builder.start();
      process.getOutputStream().close();
      byte[] text;
      try (InputStream in = process.getInputStream()) {
        // --version prints two short lines and exits; a hung emulator is caught below.
        text = in.readNBytes(4096);
      }
      if (!process.waitFor(limit.toMillis(), TimeUnit.MILLISECONDS)) {
        process.destroyForcibly();
        throw new OnChipProofException("\"" + emulator.getFileName()
            + " --version\" did not finish within " + limit.toMillis() + " ms");
      }
      return new String(text, StandardCharsets.UTF_8).lines().findFirst().orElse("").strip();
    } catch (IOException e) {
      throw new UncheckedIOException("cannot run " + emulator.getFileName() + " --version", e);
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
      throw new OnChipProofException("interrupted while asking the emulator's version", e);
    }
  }
}
