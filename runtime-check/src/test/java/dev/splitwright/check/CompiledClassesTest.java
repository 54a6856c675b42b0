package dev.splitwright.check;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatExceptionOfType;
import static org.assertj.core.api.Assertions.assertThatIllegalArgumentException;

import java.lang.reflect.Method;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

class CompiledClassesTest {

  private static final String COUNTER =
      """
      package demo;

      public final class Counter {
        private static int count;

        private Counter() {}

        public static int next() {
          return ++count;
        }
      }
      """;

  private static InMemoryCompiler compiler;

  @BeforeAll
  static void openCompiler() {
    compiler = InMemoryCompiler.create(List.of("--release", "17"));
  }

  @AfterAll
  static void closeCompiler() {
    compiler.close();
  }

  @Test
  void eachLoadDefinesAFreshClassWithItsOwnStaticState() throws Exception {
    CompiledClasses classes = compiler.compileOne("demo.Counter", COUNTER);

    Class<?> first = classes.load("demo.Counter");
    Class<?> second = classes.load("demo.Counter");

    assertThat(first).isNotSameAs(second);
    assertThat(first.getClassLoader()).isNotSameAs(second.getClassLoader());
    Method firstNext = first.getMethod("next");
    firstNext.invoke(null);
    assertThat(firstNext.invoke(null)).isEqualTo(2);
    assertThat(second.getMethod("next").invoke(null)).isEqualTo(1);
  }

  @Test
  void compilingTheSameNameTwiceGivesClassesFromDifferentLoaders() throws Exception {
    Class<?> first = compiler.compileOne("demo.Counter", COUNTER).load("demo.Counter");
    Class<?> second = compiler.compileOne("demo.Counter", COUNTER).load("demo.Counter");

    assertThat(first.getName()).isEqualTo(second.getName());
    assertThat(first).isNotEqualTo(second);
    assertThat(first.getClassLoader()).isNotSameAs(second.getClassLoader());
  }

  @Test
  void defaultLoaderSeesPlatformClassesButNotTheApplicationClassPath() throws Exception {
    CompiledClasses classes = compiler.compileOne("demo.Counter", COUNTER);
    ClassLoader loader = classes.load("demo.Counter").getClassLoader();

    assertThat(loader.getParent()).isSameAs(ClassLoader.getPlatformClassLoader());
    // java.sql is defined to the platform loader (java.sql module docs), the rest are app classes.
    assertThat(Class.forName("java.sql.Connection", false, loader)).isNotNull();
    assertThatExceptionOfType(ClassNotFoundException.class)
        .isThrownBy(() -> Class.forName(CompiledClasses.class.getName(), false, loader));
    assertThatExceptionOfType(ClassNotFoundException.class)
        .isThrownBy(() -> Class.forName(Test.class.getName(), false, loader));
  }

  @Test
  void loaderOverAnExplicitParentSeesThatParentsClasses() throws Exception {
    CompiledClasses classes = compiler.compileOne("demo.Counter", COUNTER);
    ClassLoader loader = classes.newLoader(getClass().getClassLoader());

    // Positive control for the test above: the same lookup succeeds with the app loader as parent.
    assertThat(Class.forName(CompiledClasses.class.getName(), false, loader))
        .isSameAs(CompiledClasses.class);
    assertThat(Class.forName("demo.Counter", false, loader).getClassLoader()).isSameAs(loader);
  }

  @Test
  void bytesAreCopiedOnTheWayInAndOut() {
    byte[] original = {1, 2, 3};
    CompiledClasses classes = CompiledClasses.of(Map.of("demo.Raw", original));

    original[0] = 9;
    classes.bytes("demo.Raw")[1] = 9;

    assertThat(classes.bytes("demo.Raw")).containsExactly(1, 2, 3);
    assertThat(classes.size("demo.Raw")).isEqualTo(3);
  }

  @Test
  void unknownNameListsTheKnownOnes() throws Exception {
    CompiledClasses classes = compiler.compileOne("demo.Counter", COUNTER);

    assertThatIllegalArgumentException()
        .isThrownBy(() -> classes.load("demo.Missing"))
        .withMessage("no class named demo.Missing; compiled classes are [demo.Counter]");
  }

  @Test
  void malformedClassBytesFailWhenLoadedNotWhenStored() {
    CompiledClasses classes = CompiledClasses.of(Map.of("demo.Raw", new byte[] {1, 2, 3}));

    assertThatExceptionOfType(ClassFormatError.class).isThrownBy(() -> classes.load("demo.Raw"));
  }
}
