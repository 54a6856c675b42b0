package dev.splitwright.job;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.AccessDeniedException;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.DirectoryNotEmptyException;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.FileSystemException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.NotDirectoryException;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.StandardOpenOption;
import java.nio.file.attribute.PosixFileAttributeView;
import java.nio.file.attribute.PosixFilePermission;
import java.security.SecureRandom;
import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Deque;
import java.util.EnumSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Set;

/**
 * Collects output files and writes them all or none. Each file is first written to a temporary
 * file in its own target directory (so that the final move is a rename within one file system);
 * an existing target is copied aside; then every temporary file is moved into place. If anything
 * fails, moved files are put back from their copies, new ones deleted, temporary files and the
 * directories this commit created removed: previous outputs are unchanged and nothing is left.
 *
 * <p>A new file gets the permissions the process's umask gives any new file; a replaced file keeps
 * the permissions it had, so that another user a later build stage runs as can still read it.
 */
public final class OutputFiles {
  /** Moves a finished temporary file onto its target; a seam so tests can make a move fail. */
  @FunctionalInterface
  interface Mover {
    void move(Path temp, Path target) throws IOException;
  }

  /** Writes one output's content into the (already created, empty) temporary file given. */
  @FunctionalInterface
  public interface Content {
    void writeTo(Path temp) throws IOException;
  }

  // Temporary and backup files end in this, and start with a dot so listings hide them.
  static final String TEMP_SUFFIX = ".tmp";
  private static final SecureRandom RANDOM = new SecureRandom();

  private final Map<Path, Content> pending = new LinkedHashMap<>();
  private final Mover mover;

  public OutputFiles() {
    this(OutputFiles::replace);
  }

  OutputFiles(Mover mover) {
    this.mover = Objects.requireNonNull(mover, "mover");
  }

  /** Queues {@code text} for {@code target}; a later call for the same path replaces it. */
  public void add(Path target, String text) {
    Objects.requireNonNull(text, "text");
    add(target, temp -> Files.writeString(temp, text, StandardCharsets.UTF_8));
  }

  /**
   * Queues {@code content}, which writes the file itself (to a temporary path, called during
   * {@link #commit}); a later call for the same path replaces it.
   */
  public void add(Path target, Content content) {
    pending.put(target.toAbsolutePath().normalize(), Objects.requireNonNull(content, "content"));
  }

  /** The queued paths, in the order they were added. */
  public List<Path> paths() {
    return List.copyOf(pending.keySet());
  }

  /** One queued file on its way: its temporary file, and the copy of what it replaces. */
  private static final class Staged {
    final Path target;
    Path temp;
    Path backup;
    boolean moved;

    Staged(Path target) {
      this.target = target;
    }
  }

  /**
   * Writes every queued file, creating directories as needed, or none of them.
   *
   * @throws OutputException if a file cannot be written; everything is rolled back first
   */
  public void commit() throws OutputException {
    List<Staged> staged = new ArrayList<>();
    List<Path> createdDirs = new ArrayList<>();
    Staged current = null;
    try {
      for (Map.Entry<Path, Content> e : pending.entrySet()) {
        current = new Staged(e.getKey());
        staged.add(current);
        if (Files.isDirectory(current.target)) {
          throw new FileSystemException(current.target.toString(), null, "is a directory");
        }
        Path dir = current.target.getParent();
        createDirectories(dir, createdDirs);
        current.temp = createTemp(dir, tempPrefix(current.target));
        boolean replacing = Files.exists(current.target);
        if (replacing) {
          // Before the content goes in, so a private file's new text is never more readable;
          // the owner may write meanwhile even if the old file is read-only.
          keepPermissions(current.target, current.temp, true);
        }
        e.getValue().writeTo(current.temp);
        if (replacing) {
          keepPermissions(current.target, current.temp, false);
          current.backup = Files.createTempFile(dir, tempPrefix(current.target), TEMP_SUFFIX);
          Files.copy(current.target, current.backup, StandardCopyOption.REPLACE_EXISTING,
              StandardCopyOption.COPY_ATTRIBUTES);
        }
      }
      for (Staged s : staged) {
        current = s;
        mover.move(s.temp, s.target);
        s.moved = true;
      }
    } catch (IOException e) {
      rollBack(staged, createdDirs, e);
      throw new OutputException(describe(current == null ? null : current.target, e), e);
    } catch (RuntimeException | Error e) {
      rollBack(staged, createdDirs, e);
      throw e;
    }
    for (Staged s : staged) {
      if (s.backup != null) {
        try {
          Files.deleteIfExists(s.backup);
        } catch (IOException ignored) {
          // Every output is in place; a stray copy of an old file is not worth failing for.
        }
      }
    }
  }

  private static void rollBack(List<Staged> staged, List<Path> createdDirs, Throwable failure) {
    for (int i = staged.size() - 1; i >= 0; i--) {
      Staged s = staged.get(i);
      try {
        if (s.moved) {
          if (s.backup != null) {
            replace(s.backup, s.target);
            s.backup = null;
          } else {
            Files.deleteIfExists(s.target);
          }
        }
      } catch (IOException | RuntimeException e) {
        failure.addSuppressed(e);
      }
      for (Path leftover : new Path[] {s.temp, s.backup}) {
        try {
          if (leftover != null) {
            Files.deleteIfExists(leftover);
          }
        } catch (IOException | RuntimeException e) {
          failure.addSuppressed(e);
        }
      }
    }
    for (int i = createdDirs.size() - 1; i >= 0; i--) {
      try {
        Files.deleteIfExists(createdDirs.get(i));
      } catch (DirectoryNotEmptyException e) {
        // Someone else put a file there meanwhile: theirs, so it stays.
      } catch (IOException | RuntimeException e) {
        failure.addSuppressed(e);
      }
    }
  }

  /** Creates {@code dir} and its missing parents, recording each one created, outermost first. */
  private static void createDirectories(Path dir, List<Path> created) throws IOException {
    Deque<Path> missing = new ArrayDeque<>();
    for (Path p = dir; p != null && !Files.isDirectory(p); p = p.getParent()) {
      missing.push(p);
    }
    for (Path p : missing) {
      try {
        Files.createDirectory(p);
        created.add(p);
      } catch (FileAlreadyExistsException e) {
        if (!Files.isDirectory(p)) {
          throw new FileSystemException(p.toString(), null, "is a file, not a directory");
        }
      }
    }
  }

  /**
   * Creates an empty, unused file in {@code dir} the way any new file is created, so that it gets
   * the umask's permissions ({@link Files#createTempFile} would make it owner-only, 0600).
   */
  private static Path createTemp(Path dir, String prefix) throws IOException {
    for (int attempt = 0; ; attempt++) {
      Path temp = dir.resolve(prefix + Long.toUnsignedString(RANDOM.nextLong(), 36) + TEMP_SUFFIX);
      try {
        Files.newOutputStream(temp, StandardOpenOption.CREATE_NEW, StandardOpenOption.WRITE)
            .close();
        return temp;
      } catch (FileAlreadyExistsException e) {
        if (attempt >= 100) {
          throw e;
        }
      }
    }
  }

  /**
   * Gives {@code temp} the permissions of the file it will replace, with {@code ownerWrites} also
   * the owner's read and write.
   */
  private static void keepPermissions(Path target, Path temp, boolean ownerWrites)
      throws IOException {
    PosixFileAttributeView old =
        Files.getFileAttributeView(target, PosixFileAttributeView.class);
    PosixFileAttributeView fresh = Files.getFileAttributeView(temp, PosixFileAttributeView.class);
    if (old != null && fresh != null) {
      Set<PosixFilePermission> permissions = EnumSet.noneOf(PosixFilePermission.class);
      permissions.addAll(old.readAttributes().permissions());
      if (ownerWrites) {
        permissions.add(PosixFilePermission.OWNER_READ);
        permissions.add(PosixFilePermission.OWNER_WRITE);
      }
      fresh.setPermissions(permissions);
    }
  }

  /** A short prefix naming the target: long names would push the temporary name past 255 bytes. */
  private static String tempPrefix(Path target) {
    String name = target.getFileName().toString();
    return "." + (name.length() > 40 ? name.substring(0, 40) : name) + "-";
  }

  private static void replace(Path from, Path to) throws IOException {
    try {
      Files.move(from, to, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
    } catch (AtomicMoveNotSupportedException e) {
      Files.move(from, to, StandardCopyOption.REPLACE_EXISTING);
    }
  }

  /** One line: which file, why, and that nothing changed; no exception class names. */
  private static String describe(Path target, IOException e) {
    StringBuilder out = new StringBuilder("cannot write ");
    out.append(target == null ? "the outputs" : target.toString()).append(": ");
    if (e instanceof FileSystemException fse) {
      if (fse.getFile() != null && !fse.getFile().equals(String.valueOf(target))) {
        out.append(fse.getFile()).append(": ");
      }
      out.append(reason(fse));
    } else {
      out.append(e.getMessage() == null ? "input/output error" : e.getMessage());
    }
    return out.append("; no output was changed; check free space and permissions of the output"
        + " directory").toString().replace('\n', ' ');
  }

  private static String reason(FileSystemException e) {
    if (e.getReason() != null) {
      return e.getReason();
    }
    if (e instanceof AccessDeniedException) {
      return "permission denied";
    }
    if (e instanceof NoSuchFileException) {
      return "no such file or directory";
    }
    if (e instanceof NotDirectoryException) {
      return "not a directory";
    }
    if (e instanceof FileAlreadyExistsException) {
      return "already exists";
    }
    return "input/output error";
  }
}
