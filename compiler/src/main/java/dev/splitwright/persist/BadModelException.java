package dev.splitwright.persist;

import java.util.Optional;

/**
 * A model file's content breaks a rule: where (a JSON Pointer, RFC 6901), what was expected and
 * what was found.
 */
final class BadModelException extends Exception {
  private static final long serialVersionUID = 1L;

  /** What the user can do about it, when that differs from passing another model file. */
  private final String remedy;

  BadModelException(String pointer, String expected, String found) {
    this(pointer, expected, found, null);
  }

  BadModelException(String pointer, String expected, String found, String remedy) {
    super((pointer.isEmpty() ? "/" : pointer) + ": expected " + expected + " but found " + found);
    this.remedy = remedy;
  }

  Optional<String> remedy() {
    return Optional.ofNullable(remedy);
  }
}
