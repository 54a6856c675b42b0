package dev.splitwright.report;

import com.fasterxml.jackson.core.JsonGenerator;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.util.DefaultIndenter;
import com.fasterxml.jackson.core.util.DefaultPrettyPrinter;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.SerializerProvider;
import com.fasterxml.jackson.databind.module.SimpleModule;
import com.fasterxml.jackson.databind.ser.std.StdSerializer;
import dev.splitwright.text.DecimalText;
import java.io.IOException;

/**
 * Writes reports as indented JSON with {@code \n} line ends on every platform. Floats and doubles
 * are written by {@link DecimalText}, not by Jackson, which prints them with the JDK's {@code
 * toString} and so differently on JDK 17 and JDK 19+.
 */
public final class ReportJson {
  private static final ObjectMapper MAPPER = new ObjectMapper()
      .enable(SerializationFeature.INDENT_OUTPUT)
      .registerModule(new SimpleModule("splitwright-numbers")
          .addSerializer(Double.class, new DoubleText())
          .addSerializer(double.class, new DoubleText())
          .addSerializer(Float.class, new FloatText())
          .addSerializer(float.class, new FloatText()));

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

  /** Finite values as JDK-independent text; NaN and infinities as Jackson writes them. */
  private static final class DoubleText extends StdSerializer<Double> {
    private static final long serialVersionUID = 1L;

    DoubleText() {
      super(Double.class);
    }

    @Override
    public void serialize(Double value, JsonGenerator gen, SerializerProvider provider)
        throws IOException {
      if (Double.isFinite(value)) {
        gen.writeNumber(DecimalText.shortest(value));
      } else {
        gen.writeNumber(value);
      }
    }
  }

  private static final class FloatText extends StdSerializer<Float> {
    private static final long serialVersionUID = 1L;

    FloatText() {
      super(Float.class);
    }

    @Override
    public void serialize(Float value, JsonGenerator gen, SerializerProvider provider)
        throws IOException {
      if (Float.isFinite(value)) {
        gen.writeNumber(DecimalText.shortest(value));
      } else {
        gen.writeNumber(value);
      }
    }
  }
}
