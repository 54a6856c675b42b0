package dev.splitwright.select;

import dev.splitwright.data.InputException;
import dev.splitwright.text.DecimalText;
import java.math.BigDecimal;
import java.math.RoundingMode;
import java.util.Locale;
import java.util.Objects;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Parses byte sizes such as {@code 1500}, {@code 2.5KB}, {@code 4 KiB} or {@code 1MiB}.
 *
 * <p>A size is a decimal number (digits, optionally a point and more digits) followed, after
 * optional blanks, by an optional unit: {@code B} (bytes, the default), {@code KB} = 1000, {@code
 * KiB} = 1024, {@code MB} = 1000², {@code MiB} = 1024² bytes (IEC 80000-13 prefixes). Units are
 * case-insensitive, since there is no bit unit here to confuse them with: {@code 4kb} is 4000
 * bytes. A fraction of a byte is rounded down, so the budget never exceeds what was written.
 */
public final class SizeText {
  /** The largest size accepted: sizes are counted in {@code int}s, as class files are. */
  public static final int MAX_BYTES = Integer.MAX_VALUE;

  private static final Pattern SIZE =
      Pattern.compile("(\\d+(?:\\.\\d+)?)[ \\t]*([A-Za-z]*)");
  private static final String UNITS = "B, KB, KiB, MB or MiB";

  private SizeText() {}

  /**
   * Parses {@code text} as a size in bytes for {@code option} (a bare option name used in error
   * messages, e.g. {@code budget}).
   *
   * @throws InputException if the text is not a size, names an unknown unit, is zero or exceeds
   *     {@link #MAX_BYTES}
   */
  public static int parse(String option, String text) throws InputException {
    Objects.requireNonNull(option, "option");
    Objects.requireNonNull(text, "text");
    String trimmed = text.strip();
    Matcher m = SIZE.matcher(trimmed);
    if (!m.matches()) {
      throw new InputException(option, InputException.quote(text) + " is not a size",
          "write a positive number of bytes with an optional unit " + UNITS + ", e.g. 4KiB");
    }
    long factor = switch (m.group(2).toLowerCase(Locale.ROOT)) {
      case "", "b" -> 1;
      case "kb" -> 1000;
      case "kib" -> 1024;
      case "mb" -> 1000 * 1000;
      case "mib" -> 1024 * 1024;
      default -> throw new InputException(option,
          "unknown unit " + InputException.quote(m.group(2)) + " in " + InputException.quote(text),
          "use " + UNITS);
    };
    BigDecimal bytes = new BigDecimal(m.group(1)).multiply(BigDecimal.valueOf(factor))
        .setScale(0, RoundingMode.FLOOR);
    if (bytes.compareTo(BigDecimal.valueOf(MAX_BYTES)) > 0) {
      throw new InputException(option, InputException.quote(text) + " is too large",
          "the most is " + MAX_BYTES + " bytes");
    }
    if (bytes.signum() == 0) {
      throw new InputException(option, InputException.quote(text) + " is less than one byte",
          "give a positive size");
    }
    return bytes.intValueExact();
  }

  /** Formats {@code bytes} for people: {@code 2048 B (2.00 KiB)}, or {@code 900 B}. */
  public static String describe(long bytes) {
    if (bytes < 1024) {
      return bytes + " B";
    }
    if (bytes < 1024 * 1024) {
      return bytes + " B (" + DecimalText.fixed(bytes / 1024.0, 2) + " KiB)";
    }
    return bytes + " B (" + DecimalText.fixed(bytes / (1024.0 * 1024), 2) + " MiB)";
  }
}
