package dev.splitwright.data;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.ByteArrayInputStream;
import java.nio.charset.StandardCharsets;
import org.junit.jupiter.api.Test;

class Utf8FileReaderTest {

  @Test
  void keepsReturningEndOfInputWhenReadAgainAfterTheEnd() throws Exception {
    // A Reader returns -1 at the end however often it is asked (java.io.Reader#read contract).
    byte[] bytes = "a,b\n1,é".getBytes(StandardCharsets.UTF_8);
    try (Utf8FileReader reader = new Utf8FileReader(new ByteArrayInputStream(bytes), null)) {
      char[] buffer = new char[64];

      assertThat(reader.read(buffer, 0, 64)).isEqualTo(7);
      assertThat(new String(buffer, 0, 7)).isEqualTo("a,b\n1,é");
      assertThat(reader.read(buffer, 0, 64)).isEqualTo(-1);
      assertThat(reader.read(buffer, 0, 64)).isEqualTo(-1);
      assertThat(reader.read()).isEqualTo(-1);
    }
  }
}
