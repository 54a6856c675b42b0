package dev.splitwright.backend;

import static org.assertj.core.api.Assertions.assertThat;

import dev.splitwright.cgen.CEmitOptions;
import dev.splitwright.cgen.CEmitter;
import dev.splitwright.cgen.CSource;
import dev.splitwright.check.CCompiler;
import dev.splitwright.check.ElfFile;
import dev.splitwright.check.ObjectFiles;
import dev.splitwright.data.CsvLoader;
import dev.splitwright.data.Dataset;
import dev.splitwright.data.LoadOptions;
import dev.splitwright.demo.DemoFiles;
import dev.splitwright.emit.HeaderInfo;
import dev.splitwright.emit.Layout;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.train.CartTrainer;
import dev.splitwright.train.TrainingOptions;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * The flash bytes our ELF reader finds equal what GNU binutils' {@code size -A} lists for the same
 * object file: the sum of its {@code .text*}, {@code .rodata*} and {@code .data*} sections.
 */
class FlashBytesTest {
  @TempDir Path temp;

  @ParameterizedTest
  @CsvSource({
      "cc, size, -Os, branches",
      "cc, size, -Os, table",
      "arm-none-eabi-gcc, arm-none-eabi-size, -mcpu=cortex-m4 -mthumb -Os, branches",
      "arm-none-eabi-gcc, arm-none-eabi-size, -mcpu=cortex-m4 -mthumb -Os, table"})
  void flashBytesEqualBinutilsSize(String cc, String size, String flags, String layout)
      throws Exception {
    Dataset data = CsvLoader.load(DemoFiles.pump(), LoadOptions.builder().target("state")
        .build()).dataset();
    DecisionTree tree = CartTrainer.train(data, TrainingOptions.builder().maxDepth(6).build());
    CSource source = CEmitter.emit(tree, CEmitOptions.of("pump")
        .withLayout(Layout.parse(layout).orElseThrow()), HeaderInfo.none());
    CCompiler compiler = CCompiler.find(cc, List.of(flags.split(" ")), Duration.ofMinutes(5));
    ObjectFiles objects = compiler.compileObjects(Map.of(source.headerName(),
        source.headerText(), source.sourceName(), source.sourceText()));
    Path object = temp.resolve("pump.o");
    Files.write(object, objects.bytes(source.sourceName()));

    long ours = ElfFile.parse(Files.readAllBytes(object)).flashBytes();

    assertThat(ours).isPositive().isEqualTo(BinutilsSize.flashBytes(size, object));
  }
}
