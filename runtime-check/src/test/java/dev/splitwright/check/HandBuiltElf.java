package dev.splitwright.check;

import java.io.ByteArrayOutputStream;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;

/**
 * Writes small ELF files field by field from the layout in the System V ABI (gABI chapters "ELF
 * Header", "Sections", "Symbol Table"), so the reader can be tried on byte orders and classes no
 * local compiler produces. Layout: header, section contents in order (each 8-byte aligned), the
 * section name table {@code .shstrtab} added last, then the section header table.
 */
final class HandBuiltElf {

  /** A section to write; {@code contents} is ignored for SHT_NOBITS, which has {@code size}. */
  record Section(String name, int type, long flags, byte[] contents, long size, int link,
      long entrySize) {

    static Section progbits(String name, long flags, int length) {
      return new Section(name, 1, flags, new byte[length], length, 0, 0);
    }

    static Section nobits(String name, long flags, long size) {
      return new Section(name, 8, flags, new byte[0], size, 0, 0);
    }
  }

  /** Offsets of the ELF header fields the tests patch, for ELF32 and ELF64 (gABI "ELF Header"). */
  static int shnumOffset(boolean is64) {
    return is64 ? 60 : 48;
  }

  static int shstrndxOffset(boolean is64) {
    return is64 ? 62 : 50;
  }

  static int shoffOffset(boolean is64) {
    return is64 ? 40 : 32;
  }

  private HandBuiltElf() {}

  static byte[] build(boolean is64, ByteOrder order, int machine, List<Section> given) {
    List<Section> sections = new ArrayList<>(given);
    ByteArrayOutputStream names = new ByteArrayOutputStream();
    names.write(0);
    List<Integer> nameOffsets = new ArrayList<>();
    for (Section s : sections) {
      nameOffsets.add(names.size());
      names.writeBytes((s.name() + "\0").getBytes(StandardCharsets.US_ASCII));
    }
    nameOffsets.add(names.size());
    names.writeBytes(".shstrtab\0".getBytes(StandardCharsets.US_ASCII));
    byte[] nameTable = names.toByteArray();
    sections.add(new Section(".shstrtab", 3, 0, nameTable, nameTable.length, 0, 0));

    int headerSize = is64 ? 64 : 52;
    int entrySize = is64 ? 64 : 40;
    long[] offsets = new long[sections.size()];
    int at = headerSize;
    for (int i = 0; i < sections.size(); i++) {
      at = align8(at);
      offsets[i] = at;
      if (sections.get(i).type() != 8) {
        at += sections.get(i).contents().length;
      }
    }
    int shoff = align8(at);
    int count = sections.size() + 1;
    ByteBuffer out = ByteBuffer.allocate(shoff + count * entrySize).order(order);
    out.put(new byte[] {0x7f, 'E', 'L', 'F', (byte) (is64 ? 2 : 1),
        (byte) (order == ByteOrder.LITTLE_ENDIAN ? 1 : 2), 1});
    out.position(16);
    out.putShort((short) 1); // e_type ET_REL
    out.putShort((short) machine);
    out.putInt(1); // e_version
    word(out, is64, 0); // e_entry
    word(out, is64, 0); // e_phoff
    word(out, is64, shoff);
    out.putInt(0); // e_flags
    out.putShort((short) headerSize);
    out.putShort((short) 0); // e_phentsize
    out.putShort((short) 0); // e_phnum
    out.putShort((short) entrySize);
    out.putShort((short) count);
    out.putShort((short) (count - 1)); // .shstrtab is last
    for (int i = 0; i < sections.size(); i++) {
      Section s = sections.get(i);
      if (s.type() != 8) {
        out.put((int) offsets[i], s.contents());
      }
      int h = shoff + (i + 1) * entrySize;
      out.position(h);
      out.putInt(nameOffsets.get(i));
      out.putInt(s.type());
      word(out, is64, s.flags());
      word(out, is64, 0); // sh_addr
      word(out, is64, offsets[i]);
      word(out, is64, s.size());
      out.putInt(s.link());
      out.putInt(0); // sh_info
      word(out, is64, 8); // sh_addralign
      word(out, is64, s.entrySize());
    }
    return out.array();
  }

  /** A symbol table entry (gABI "Symbol Table"); the field order differs between the classes. */
  static byte[] symbol(
      boolean is64, ByteOrder order, int name, long value, long size, int info, int shndx) {
    ByteBuffer out = ByteBuffer.allocate(is64 ? 24 : 16).order(order);
    out.putInt(name);
    if (is64) {
      out.put((byte) info).put((byte) 0).putShort((short) shndx);
      out.putLong(value).putLong(size);
    } else {
      out.putInt((int) value).putInt((int) size);
      out.put((byte) info).put((byte) 0).putShort((short) shndx);
    }
    return out.array();
  }

  private static void word(ByteBuffer out, boolean is64, long value) {
    if (is64) {
      out.putLong(value);
    } else {
      out.putInt((int) value);
    }
  }

  private static int align8(int offset) {
    return (offset + 7) & ~7;
  }
}
