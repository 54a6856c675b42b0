package dev.splitwright.check;

import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Objects;
import java.util.zip.Adler32;

/**
 * The header, strings, types and class definitions of a DEX file, read by hand as the AOSP page
 * "Dalvik executable format" describes them ({@code header_item}, {@code string_id_item}, {@code
 * string_data_item}, {@code type_id_item}, {@code class_def_item}). Versions 035 to 039, standard
 * (little-endian) byte order. Code, fields and methods are not read: the file's length is what a
 * size budget needs, and the class list says what the file holds.
 *
 * <p>Immutable; the bytes are copied on the way in.
 */
public final class DexFile {

  /** Length of {@code header_item} in versions 035 to 039. */
  public static final int HEADER_SIZE = 0x70;

  private static final long ENDIAN_CONSTANT = 0x12345678L;
  private static final long REVERSE_ENDIAN_CONSTANT = 0x78563412L;
  private static final int CHECKSUM_OFFSET = 8;
  private static final int SIGNATURE_OFFSET = 12;
  private static final int SIGNATURE_LENGTH = 20;
  private static final int FILE_SIZE_OFFSET = 0x20;
  private static final int CLASS_DEF_ITEM_SIZE = 32;

  private final byte[] bytes;
  private final int version;
  private final long checksum;
  private final byte[] signature;
  private final List<String> strings;
  private final List<String> types;
  private final List<String> classDescriptors;

  private DexFile(
      byte[] bytes,
      int version,
      long checksum,
      byte[] signature,
      List<String> strings,
      List<String> types,
      List<String> classDescriptors) {
    this.bytes = bytes;
    this.version = version;
    this.checksum = checksum;
    this.signature = signature;
    this.strings = List.copyOf(strings);
    this.types = List.copyOf(types);
    this.classDescriptors = List.copyOf(classDescriptors);
  }

  /**
   * Parses a DEX file held in memory. The checksum and signature are read but not checked; see
   * {@link #verifyChecksum()} and {@link #verifySignature()}.
   *
   * @throws IllegalArgumentException if the bytes are not a DEX file of a known version, are
   *     truncated, or an item points outside the file; the message names the offset
   */
  public static DexFile parse(byte[] bytes) {
    byte[] copy = Objects.requireNonNull(bytes, "bytes").clone();
    DexReader in = new DexReader(copy);
    int version = version(copy);
    in.need(0, HEADER_SIZE, "header_item");
    long checksum = in.u32Raw(CHECKSUM_OFFSET, "checksum");
    byte[] signature = in.slice(SIGNATURE_OFFSET, SIGNATURE_LENGTH, "signature");
    int fileSize = in.u32(FILE_SIZE_OFFSET, "file_size");
    if (fileSize != copy.length) {
      throw DexReader.error(
          FILE_SIZE_OFFSET,
          "file_size is " + fileSize + " but the file has " + copy.length + " bytes");
    }
    int headerSize = in.u32(0x24, "header_size");
    if (headerSize != HEADER_SIZE) {
      throw DexReader.error(0x24, "header_size is " + headerSize + ", expected " + HEADER_SIZE);
    }
    long endianTag = in.u32Raw(0x28, "endian_tag");
    if (endianTag == REVERSE_ENDIAN_CONSTANT) {
      throw DexReader.error(0x28, "reverse-endian DEX files are not supported");
    }
    if (endianTag != ENDIAN_CONSTANT) {
      throw DexReader.error(0x28, "endian_tag is 0x" + Long.toHexString(endianTag));
    }
    List<String> strings = readStrings(in);
    List<String> types = readTypes(in, strings);
    List<String> classes = readClassDescriptors(in, types);
    return new DexFile(copy, version, checksum, signature, strings, types, classes);
  }

  /** The format version from the magic: 35, 37, 38 or 39 (036 was never used, but is accepted). */
  public int version() {
    return version;
  }

  /** The file's length in bytes, equal to the header's {@code file_size}. */
  public int fileSize() {
    return bytes.length;
  }

  /** The header's {@code checksum}: Adler-32 of everything after it. */
  public long checksum() {
    return checksum;
  }

  /** A copy of the header's 20-byte {@code signature}: SHA-1 of everything after it. */
  public byte[] signature() {
    return signature.clone();
  }

  /** A copy of the whole file. */
  public byte[] bytes() {
    return bytes.clone();
  }

  /** Every string of {@code string_ids}, in file order (which the format requires to be sorted). */
  public List<String> strings() {
    return strings;
  }

  /** The descriptor of every {@code type_ids} entry, in file order: {@code Ljava/lang/Object;}. */
  public List<String> typeDescriptors() {
    return types;
  }

  /** The descriptor of each class defined, in {@code class_defs} order: {@code Ldemo/Pump;}. */
  public List<String> classDescriptors() {
    return classDescriptors;
  }

  /** Whether the header's checksum equals the Adler-32 of the bytes from offset 12 to the end. */
  public boolean verifyChecksum() {
    Adler32 adler = new Adler32();
    adler.update(bytes, SIGNATURE_OFFSET, bytes.length - SIGNATURE_OFFSET);
    return adler.getValue() == checksum;
  }

  /** Whether the header's signature equals the SHA-1 of the bytes from offset 32 to the end. */
  public boolean verifySignature() {
    MessageDigest sha1;
    try {
      sha1 = MessageDigest.getInstance("SHA-1");
    } catch (NoSuchAlgorithmException e) {
      // Every Java platform must provide SHA-1 (java.security.MessageDigest's contract).
      throw new IllegalStateException(e);
    }
    int start = SIGNATURE_OFFSET + SIGNATURE_LENGTH;
    sha1.update(bytes, start, bytes.length - start);
    return Arrays.equals(sha1.digest(), signature);
  }

  @Override
  public String toString() {
    return "DexFile[version=0"
        + version
        + ", "
        + bytes.length
        + " bytes, classes="
        + classDescriptors
        + "]";
  }

  /** Checks the magic {@code "dex\n0NN\0"} and returns NN. */
  private static int version(byte[] bytes) {
    byte[] prefix = "dex\n0".getBytes(StandardCharsets.US_ASCII);
    boolean magic = bytes.length >= 8 && bytes[7] == 0;
    for (int i = 0; magic && i < prefix.length; i++) {
      magic = bytes[i] == prefix[i];
    }
    if (!magic) {
      throw DexReader.error(0, "not a DEX file: it does not start with \"dex\\n0\" ... \"\\0\"");
    }
    int tens = bytes[5] - '0';
    int ones = bytes[6] - '0';
    int version = tens * 10 + ones;
    if (tens != 3 || ones < 5 || ones > 9) {
      String digits = new String(bytes, 4, 3, StandardCharsets.US_ASCII);
      throw DexReader.error(5, "version " + digits + " is not 035 to 039");
    }
    return version;
  }

  private static List<String> readStrings(DexReader in) {
    int size = in.u32(0x38, "string_ids_size");
    int off = in.u32(0x3C, "string_ids_off");
    in.need(off, 4L * size, "string_ids");
    List<String> strings = new ArrayList<>(size);
    for (int i = 0; i < size; i++) {
      int dataOff = in.u32(off + 4L * i, "string_data_off of string " + i);
      strings.add(in.mutf8String(dataOff, "string_data_item " + i));
    }
    return strings;
  }

  private static List<String> readTypes(DexReader in, List<String> strings) {
    int size = in.u32(0x40, "type_ids_size");
    int off = in.u32(0x44, "type_ids_off");
    in.need(off, 4L * size, "type_ids");
    List<String> types = new ArrayList<>(size);
    for (int i = 0; i < size; i++) {
      long at = off + 4L * i;
      int index = in.u32(at, "descriptor_idx of type " + i);
      if (index >= strings.size()) {
        throw DexReader.error(
            at, "descriptor_idx " + index + " of type " + i + " is not below " + strings.size());
      }
      types.add(strings.get(index));
    }
    return types;
  }

  private static List<String> readClassDescriptors(DexReader in, List<String> types) {
    int size = in.u32(0x60, "class_defs_size");
    int off = in.u32(0x64, "class_defs_off");
    in.need(off, (long) CLASS_DEF_ITEM_SIZE * size, "class_defs");
    List<String> classes = new ArrayList<>(size);
    for (int i = 0; i < size; i++) {
      long at = off + (long) CLASS_DEF_ITEM_SIZE * i;
      int index = in.u32(at, "class_idx of class_def " + i);
      if (index >= types.size()) {
        throw DexReader.error(
            at, "class_idx " + index + " of class_def " + i + " is not below " + types.size());
      }
      classes.add(types.get(index));
    }
    return classes;
  }
}
