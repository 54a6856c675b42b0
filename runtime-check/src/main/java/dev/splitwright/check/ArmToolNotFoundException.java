package dev.splitwright.check;

import java.util.List;
import java.util.Objects;

/**
 * A tool needed to build or emulate Cortex-M images ({@code arm-none-eabi-gcc} or {@code
 * qemu-system-arm}) is not installed. The message names the tool and the Debian packages that
 * provide it.
 */
public final class ArmToolNotFoundException extends Exception {

  private static final long serialVersionUID = 1L;

  private final String tool;
  private final List<String> debianPackages;

  ArmToolNotFoundException(String tool, String where, List<String> debianPackages) {
    super(
        "\"" + tool + "\" not found: " + where + "; install the Debian package"
            + (debianPackages.size() == 1 ? " " : "s ") + String.join(" and ", debianPackages));
    this.tool = Objects.requireNonNull(tool, "tool");
    this.debianPackages = List.copyOf(debianPackages);
  }

  /** The command as given, e.g. {@code qemu-system-arm}. */
  public String tool() {
    return tool;
  }

  /** The Debian packages that provide the tool, e.g. {@code [qemu-system-arm]}. */
  public List<String> debianPackages() {
    return debianPackages;
  }
}
