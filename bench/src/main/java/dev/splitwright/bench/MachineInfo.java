package dev.splitwright.bench;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;

/** What the results header says about the machine, read from Linux's {@code /proc}. */
record MachineInfo(String cpu, long logicalCores, long memoryMib, String loadAverage) {

  static MachineInfo read() {
    List<String> cpuinfo = lines(Path.of("/proc/cpuinfo"));
    List<String> details = new ArrayList<>();
    field(cpuinfo, "cpu family").ifPresent(f -> details.add("family " + f));
    field(cpuinfo, "model").ifPresent(m -> details.add("model " + m));
    field(cpuinfo, "cache size").ifPresent(c -> details.add(c + " cache"));
    String cpu = field(cpuinfo, "model name").orElse("unknown CPU")
        + (details.isEmpty() ? "" : " (" + String.join(", ", details) + ")");
    long cores = cpuinfo.stream().filter(l -> l.startsWith("processor")).count();
    if (cores == 0) {
      cores = Runtime.getRuntime().availableProcessors();
    }
    long memoryKib = lines(Path.of("/proc/meminfo")).stream()
        .filter(l -> l.startsWith("MemTotal:"))
        .findFirst()
        .map(l -> Long.parseLong(l.replaceAll("[^0-9]", "")))
        .orElse(0L);
    return new MachineInfo(cpu, cores, memoryKib / 1024, currentLoadAverage());
  }

  /** The value of the first {@code name : value} line whose name is exactly {@code name}. */
  private static Optional<String> field(List<String> cpuinfo, String name) {
    return cpuinfo.stream()
        .filter(l -> l.indexOf(':') > 0 && l.substring(0, l.indexOf(':')).trim().equals(name))
        .findFirst()
        .map(l -> l.substring(l.indexOf(':') + 1).trim());
  }

  /** The 1, 5 and 15 minute load averages, e.g. {@code 1.02 0.87 0.60}. */
  static String currentLoadAverage() {
    List<String> load = lines(Path.of("/proc/loadavg"));
    if (load.isEmpty()) {
      return "unknown";
    }
    String[] parts = load.get(0).split(" ");
    return String.join(" ", parts[0], parts[1], parts[2]);
  }

  String describe() {
    return String.format(Locale.ROOT, "%s, %d logical cores, %d MiB RAM", cpu, logicalCores,
        memoryMib);
  }

  private static List<String> lines(Path file) {
    try {
      return Files.readAllLines(file);
    } catch (IOException e) {
      return List.of();
    }
  }
}
