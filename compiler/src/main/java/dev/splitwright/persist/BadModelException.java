package dev.splitwright.persist;

/**
 * A model file's content breaks a rule: where (a JSON Pointer, RFC 6901), what was expected and
 * what was found.
 */
final class BadModelException extends Exception {
  private static final long serialVersionUID = 1L;

  BadModelException(String pointer, String expected, String found) {
    super((pointer.isEmpty() ? "/" : pointer) + ": expected " + expected + " but found " + found);
  }
}
