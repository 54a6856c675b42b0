package dev.splitwright.verify;

import java.io.ByteArrayInputStream;
import java.io.DataInputStream;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.util.ArrayList;
import java.util.List;

/**
 * The instructions of one method of a class file, read as the JVM Specification (Java SE 17)
 * describes them: the class file structure in §4.1, the constant pool tags in §4.4, the Code
 * attribute in §4.7.3 and the instruction formats in §6.5. Test code only: it knows just enough
 * to list the opcodes and branch targets of the small methods the emitters write.
 */
final class MethodOpcodes {
  /** One instruction: where it starts, its opcode and, for a branch, where it jumps to. */
  record Instruction(int offset, int opcode, int target) {
    boolean conditionalBranch() {
      // ifeq (0x99) to if_acmpne (0xa6), ifnull (0xc6), ifnonnull (0xc7): JVMS §6.5.
      return opcode >= 0x99 && opcode <= 0xa6 || opcode == 0xc6 || opcode == 0xc7;
    }

    boolean isGoto() {
      return opcode == 0xa7 || opcode == 0xc8;
    }
  }

  private MethodOpcodes() {}

  /** The instructions of the method named {@code name} (the first one, if overloaded). */
  static List<Instruction> of(byte[] classFile, String name) {
    try {
      return read(new DataInputStream(new ByteArrayInputStream(classFile)), name);
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  private static List<Instruction> read(DataInputStream in, String wanted) throws IOException {
    in.readInt(); // magic
    in.readUnsignedShort();
    in.readUnsignedShort();
    int count = in.readUnsignedShort();
    String[] utf8 = new String[count];
    for (int i = 1; i < count; i++) {
      int tag = in.readUnsignedByte();
      switch (tag) {
        case 1 -> utf8[i] = in.readUTF();
        case 3, 4, 9, 10, 11, 12, 17, 18 -> in.skipBytes(4);
        case 5, 6 -> {
          in.skipBytes(8);
          i++; // a long or double takes two entries (JVMS §4.4.5)
        }
        case 7, 8, 16, 19, 20 -> in.skipBytes(2);
        case 15 -> in.skipBytes(3);
        default -> throw new IllegalArgumentException("constant pool tag " + tag);
      }
    }
    in.skipBytes(6); // access flags, this class, super class
    in.skipBytes(2 * in.readUnsignedShort());
    skipMembers(in);
    int methods = in.readUnsignedShort();
    for (int m = 0; m < methods; m++) {
      in.skipBytes(2);
      String name = utf8[in.readUnsignedShort()];
      in.skipBytes(2);
      int attributes = in.readUnsignedShort();
      for (int a = 0; a < attributes; a++) {
        String attribute = utf8[in.readUnsignedShort()];
        int length = in.readInt();
        if (name.equals(wanted) && attribute.equals("Code")) {
          in.skipBytes(4); // max_stack, max_locals
          byte[] code = new byte[in.readInt()];
          in.readFully(code);
          return decode(code);
        }
        in.skipBytes(length);
      }
    }
    throw new IllegalArgumentException("no method " + wanted);
  }

  private static void skipMembers(DataInputStream in) throws IOException {
    int members = in.readUnsignedShort();
    for (int f = 0; f < members; f++) {
      in.skipBytes(6);
      int attributes = in.readUnsignedShort();
      for (int a = 0; a < attributes; a++) {
        in.skipBytes(2);
        in.skipBytes(in.readInt());
      }
    }
  }

  private static List<Instruction> decode(byte[] code) {
    List<Instruction> out = new ArrayList<>();
    int pc = 0;
    while (pc < code.length) {
      int op = code[pc] & 0xff;
      int target = -1;
      if (op >= 0x99 && op <= 0xa8 || op == 0xc6 || op == 0xc7) {
        target = pc + (short) ((code[pc + 1] & 0xff) << 8 | (code[pc + 2] & 0xff));
      }
      out.add(new Instruction(pc, op, target));
      pc += length(code, pc, op);
    }
    return out;
  }

  /** The instruction's length in bytes, JVMS §6.5. */
  private static int length(byte[] code, int pc, int op) {
    if (op == 0xaa || op == 0xab) {
      throw new IllegalArgumentException("switch at " + pc + ": a multi-way branch");
    }
    if (op == 0xc4) { // wide: iinc takes 6 bytes, a load or store 4
      return (code[pc + 1] & 0xff) == 0x84 ? 6 : 4;
    }
    if (op == 0x10 || op == 0x12 || op >= 0x15 && op <= 0x19 || op >= 0x36 && op <= 0x3a
        || op == 0xa9 || op == 0xbc) {
      return 2;
    }
    if (op == 0x11 || op == 0x13 || op == 0x14 || op == 0x84 || op >= 0x99 && op <= 0xa8
        || op >= 0xb2 && op <= 0xb8 || op == 0xbb || op == 0xbd || op == 0xc0 || op == 0xc1
        || op == 0xc6 || op == 0xc7) {
      return 3;
    }
    if (op == 0xc5) {
      return 4;
    }
    if (op == 0xb9 || op == 0xba || op == 0xc8 || op == 0xc9) {
      return 5;
    }
    return 1;
  }
}
