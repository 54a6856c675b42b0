package dev.splitwright.report;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.util.DefaultIndenter;
import com.fasterxml.jackson.core.util.DefaultPrettyPrinter;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;

/** Writes reports as indented JSON with {@code \n} line ends on every platform. */
public final class ReportJson {
  private static final ObjectMapper MAPPER = new ObjectMapper()
      .enable(SerializationFeature.INDENT_OUTPUT);

  private ReportJson() {}

  /** Renders {@code value} as JSON text ending in a newline. */
  public static String render(Object value) {
    DefaultPrettyPrinter printer = new DefaultPrettyPrinter()
        .withObjectIndenter(new DefaultIndenter("  ", "\n"));
    try {
      return MAPPER.writer(printer).writeValueAsString(value) + "\n";
    } catch (JsonProcessingException e) {
      throw new IllegalStateException("report could not be serialised", e);
    }
  }
}
