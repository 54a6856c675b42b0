package dev.splitwright.backend;

import static org.assertj.core.api.Assertions.assertThat;

import dev.splitwright.check.InMemoryCompiler;
import dev.splitwright.emit.EmitOptions;
import dev.splitwright.verify.Verifier;
import org.junit.jupiter.api.Test;

class JavacWarmUpTest {
  private static final EmitOptions OPTIONS = EmitOptions.builder("demo.warm", "Warm").build();

  private static void awaitCalls(InMemoryCompiler compiler, int calls) throws InterruptedException {
    long deadline = System.nanoTime() + 60_000_000_000L;
    while (compiler.calls() < calls && System.nanoTime() < deadline) {
      Thread.sleep(20);
    }
  }

  @Test
  void compilesItsRoundsThenStops() throws InterruptedException {
    Verifier verifier = Verifier.create();
    try {
      JavacWarmUp.start(OPTIONS, verifier);
      awaitCalls(verifier.compiler(), JavacWarmUp.ROUNDS);
      Thread.sleep(500);

      assertThat(verifier.compiler().calls()).isEqualTo(JavacWarmUp.ROUNDS);
    } finally {
      verifier.compiler().close();
    }
  }

  @Test
  void givesWayOnceTheJobCompiles() throws Exception {
    Verifier verifier = Verifier.create();
    InMemoryCompiler compiler = verifier.compiler();
    try {
      // Holding the compiler's lock keeps the warm-up from compiling before the job does.
      synchronized (compiler) {
        JavacWarmUp.start(OPTIONS, verifier);
        compiler.compileOne("demo.Job", "package demo; final class Job {}");
      }
      Thread.sleep(1500);

      assertThat(compiler.calls()).isEqualTo(1);
    } finally {
      compiler.close();
    }
  }

  @Test
  void stopsWhenTheJobEnds() throws InterruptedException {
    Verifier verifier = Verifier.create();
    try {
      Runnable stop = JavacWarmUp.start(OPTIONS, verifier);
      stop.run();
      Thread.sleep(1500);

      assertThat(verifier.compiler().calls()).isLessThanOrEqualTo(1);
    } finally {
      verifier.compiler().close();
    }
  }
}
