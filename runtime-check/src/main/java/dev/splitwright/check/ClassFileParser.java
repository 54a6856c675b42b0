package dev.splitwright.check;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.Set;
import java.util.SortedSet;
import java.util.TreeSet;

/** Walks the ClassFile structure of JVMS §4.1 once; the section numbers below refer to it. */
final class ClassFileParser {

  private static final long MAGIC = 0xCAFE_BABEL;

  // Constant pool tags, table 4.4-B.
  private static final int UTF8 = 1;
  private static final int INTEGER = 3;
  private static final int FLOAT = 4;
  private static final int LONG = 5;
  private static final int DOUBLE = 6;
  private static final int CLASS = 7;
  private static final int STRING = 8;
  private static final int FIELDREF = 9;
  private static final int METHODREF = 10;
  private static final int INTERFACE_METHODREF = 11;
  private static final int NAME_AND_TYPE = 12;
  private static final int METHOD_HANDLE = 15;
  private static final int METHOD_TYPE = 16;
  private static final int DYNAMIC = 17;
  private static final int INVOKE_DYNAMIC = 18;
  private static final int MODULE = 19;
  private static final int PACKAGE = 20;

  private static final Set<String> DEBUG_IN_CODE =
      Set.of("LineNumberTable", "LocalVariableTable", "LocalVariableTypeTable");

  private enum Holder {
    CLASS,
    FIELD,
    METHOD,
    CODE
  }

  private final ClassFileReader in;
  private int[] tags;
  private int[] offsets;
  private int[] firstRefs;
  private int[] secondRefs;
  private String[] strings;
  private int lineNumberTableBytes;
  private int debugAttributeBytes;
  private int codeLength;
  private boolean sawCode;

  ClassFileParser(byte[] classFile) {
    this.in = new ClassFileReader(classFile);
  }

  ClassFileInfo parse() {
    long magic = in.u4("magic");
    if (magic != MAGIC) {
      throw in.error(0, String.format("magic is 0x%08X, expected 0xCAFEBABE", magic));
    }
    int minor = in.u2("minor_version");
    int major = in.u2("major_version");
    int poolCount = readConstantPool();
    SortedSet<String> referenced = new TreeSet<>();
    collectPoolReferences(referenced);

    int accessFlags = in.u2("access_flags");
    int at = in.offset();
    String className = className(in.u2("this_class"), at, "this_class");
    at = in.offset();
    int superIndex = in.u2("super_class");
    Optional<String> superName =
        superIndex == 0 ? Optional.empty() : Optional.of(className(superIndex, at, "super_class"));
    int interfaceCount = in.u2("interfaces_count");
    List<String> interfaces = new ArrayList<>(interfaceCount);
    for (int i = 0; i < interfaceCount; i++) {
      at = in.offset();
      interfaces.add(className(in.u2("interfaces[" + i + "]"), at, "interfaces[" + i + "]"));
    }

    int fieldCount = in.u2("fields_count");
    for (int i = 0; i < fieldCount; i++) {
      readMember("field", Holder.FIELD, referenced);
    }
    int methodCount = in.u2("methods_count");
    List<MethodSize> methods = new ArrayList<>(methodCount);
    for (int i = 0; i < methodCount; i++) {
      methods.add(readMember("method", Holder.METHOD, referenced));
    }
    readAttributes(Holder.CLASS);
    if (in.remaining() > 0) {
      throw in.error(in.offset(), in.remaining() + " bytes after the last class attribute");
    }
    return new ClassFileInfo(
        minor,
        major,
        poolCount,
        accessFlags,
        className,
        superName,
        interfaces,
        fieldCount,
        methods,
        referenced,
        lineNumberTableBytes,
        debugAttributeBytes);
  }

  /** §4.4; returns constant_pool_count. */
  private int readConstantPool() {
    int count = in.u2("constant_pool_count");
    if (count == 0) {
      throw in.error(in.offset() - 2, "constant_pool_count is 0, must be at least 1");
    }
    tags = new int[count];
    offsets = new int[count];
    firstRefs = new int[count];
    secondRefs = new int[count];
    strings = new String[count];
    for (int i = 1; i < count; i++) {
      int at = in.offset();
      String entry = "constant #" + i;
      int tag = in.u1(entry + " tag");
      tags[i] = tag;
      offsets[i] = at;
      switch (tag) {
        case UTF8 -> strings[i] = in.utf8(entry);
        case INTEGER, FLOAT -> in.skip(4, entry);
        case LONG, DOUBLE -> {
          in.skip(8, entry);
          // §4.4.5: the next index is valid but unusable, so it must exist.
          if (i + 1 >= count) {
            throw in.error(at, entry + " is 8 bytes wide but is the last pool index");
          }
          i++;
        }
        case CLASS, STRING, METHOD_TYPE, MODULE, PACKAGE -> firstRefs[i] = in.u2(entry);
        case FIELDREF, METHODREF, INTERFACE_METHODREF, NAME_AND_TYPE, DYNAMIC, INVOKE_DYNAMIC -> {
          firstRefs[i] = in.u2(entry);
          secondRefs[i] = in.u2(entry);
        }
        case METHOD_HANDLE -> {
          int kind = in.u1(entry + " reference_kind");
          if (kind < 1 || kind > 9) {
            throw in.error(at, entry + " has reference_kind " + kind + ", must be 1..9 (§4.4.8)");
          }
          firstRefs[i] = in.u2(entry);
        }
        default -> throw in.error(at, entry + " has unknown tag " + tag);
      }
    }
    validatePoolReferences(count);
    return count;
  }

  private void validatePoolReferences(int count) {
    for (int i = 1; i < count; i++) {
      switch (tags[i]) {
        case CLASS, STRING, METHOD_TYPE, MODULE, PACKAGE -> expect(firstRefs[i], UTF8, i);
        case NAME_AND_TYPE -> {
          expect(firstRefs[i], UTF8, i);
          expect(secondRefs[i], UTF8, i);
        }
        case FIELDREF, METHODREF, INTERFACE_METHODREF -> {
          expect(firstRefs[i], CLASS, i);
          expect(secondRefs[i], NAME_AND_TYPE, i);
        }
        // The first item is an index into BootstrapMethods, not into the pool.
        case DYNAMIC, INVOKE_DYNAMIC -> expect(secondRefs[i], NAME_AND_TYPE, i);
        case METHOD_HANDLE -> {
          int target = tags[checkIndex(firstRefs[i], offsets[i], "constant #" + i)];
          if (target != FIELDREF && target != METHODREF && target != INTERFACE_METHODREF) {
            throw in.error(offsets[i], "constant #" + i + " is a method handle to tag " + target);
          }
        }
        default -> {
          // UTF8, numbers and the unusable second slot of LONG and DOUBLE refer to nothing.
        }
      }
    }
  }

  private void collectPoolReferences(SortedSet<String> referenced) {
    for (int i = 1; i < tags.length; i++) {
      switch (tags[i]) {
        case CLASS -> addClassName(strings[firstRefs[i]], offsets[i], referenced);
        case NAME_AND_TYPE -> addDescriptorClasses(strings[secondRefs[i]], offsets[i], referenced);
        case METHOD_TYPE -> addDescriptorClasses(strings[firstRefs[i]], offsets[i], referenced);
        default -> {
          // Other entries name members, constants or modules, not classes.
        }
      }
    }
  }

  /** field_info and method_info have the same layout (§4.5, §4.6); fields' sizes are dropped. */
  private MethodSize readMember(String kind, Holder holder, SortedSet<String> referenced) {
    in.u2(kind + " access_flags");
    int at = in.offset();
    String name = utf8(in.u2(kind + " name_index"), at, kind + " name_index");
    at = in.offset();
    String descriptor = utf8(in.u2(kind + " descriptor_index"), at, kind + " descriptor_index");
    addDescriptorClasses(descriptor, at, referenced);
    codeLength = 0;
    sawCode = false;
    readAttributes(holder);
    return new MethodSize(name, descriptor, codeLength);
  }

  /** §4.7: u2 count, then attribute_name_index u2, attribute_length u4, info. */
  private void readAttributes(Holder holder) {
    int count = in.u2(holder.name().toLowerCase(Locale.ROOT) + " attributes_count");
    for (int i = 0; i < count; i++) {
      int at = in.offset();
      String name = utf8(in.u2("attribute_name_index"), at, "attribute_name_index");
      long length = in.u4(name + " attribute_length");
      int start = in.offset();
      if (length > in.remaining()) {
        throw in.error(
            at, name + " attribute_length " + length + " exceeds the " + in.remaining()
                + " bytes left");
      }
      if (holder == Holder.METHOD && name.equals("Code")) {
        if (sawCode) {
          throw in.error(at, "second Code attribute in one method");
        }
        sawCode = true;
        readCode();
      } else {
        in.skip(length, name);
      }
      long consumed = in.offset() - start;
      if (consumed != length) {
        throw in.error(at, name + " attribute_length is " + length + " but its contents take "
            + consumed);
      }
      int total = 6 + (int) length;
      // Table 4.7-C: where each of these attributes may appear.
      if ((holder == Holder.CODE && DEBUG_IN_CODE.contains(name))
          || (holder == Holder.CLASS && name.equals("SourceFile"))) {
        debugAttributeBytes += total;
      }
      if (holder == Holder.CODE && name.equals("LineNumberTable")) {
        lineNumberTableBytes += total;
      }
    }
  }

  /** §4.7.3. */
  private void readCode() {
    in.u2("max_stack");
    in.u2("max_locals");
    int at = in.offset();
    long length = in.u4("code_length");
    if (length == 0 || length > 65535) {
      throw in.error(at, "code_length is " + length + ", must be in 1..65535");
    }
    in.skip(length, "code");
    int handlers = in.u2("exception_table_length");
    in.skip(8L * handlers, "exception_table");
    readAttributes(Holder.CODE);
    codeLength = (int) length;
  }

  private String className(int index, int at, String item) {
    expectAt(index, CLASS, at, item);
    return strings[firstRefs[index]];
  }

  private String utf8(int index, int at, String item) {
    expectAt(index, UTF8, at, item);
    return strings[index];
  }

  private void expect(int index, int tag, int entry) {
    expectAt(index, tag, offsets[entry], "constant #" + entry);
  }

  private void expectAt(int index, int tag, int at, String item) {
    int actual = tags[checkIndex(index, at, item)];
    if (actual != tag) {
      throw in.error(
          at, item + " refers to constant #" + index + " with tag " + actual + ", expected "
              + tag);
    }
  }

  private int checkIndex(int index, int at, String item) {
    if (index < 1 || index >= tags.length) {
      throw in.error(at, item + " refers to constant #" + index + " outside 1.."
          + (tags.length - 1));
    }
    return index;
  }

  private void addClassName(String name, int at, SortedSet<String> out) {
    if (name.startsWith("[")) {
      addDescriptorClasses(name, at, out);
    } else {
      out.add(name);
    }
  }

  /** Picks the {@code L...;} class names out of a field or method descriptor (§4.3). */
  private void addDescriptorClasses(String descriptor, int at, SortedSet<String> out) {
    int i = 0;
    while (i < descriptor.length()) {
      char c = descriptor.charAt(i);
      if (c == 'L') {
        int end = descriptor.indexOf(';', i);
        if (end <= i + 1) {
          throw in.error(at, "descriptor " + descriptor + " has an unterminated class name");
        }
        out.add(descriptor.substring(i + 1, end));
        i = end + 1;
      } else if ("()[BCDFIJSZV".indexOf(c) >= 0) {
        i++;
      } else {
        throw in.error(at, "descriptor " + descriptor + " has unexpected character '" + c + "'");
      }
    }
  }
}
