package dev.splitwright.emit;

import com.palantir.javapoet.ArrayTypeName;
import com.palantir.javapoet.CodeBlock;
import com.palantir.javapoet.MethodSpec;
import com.palantir.javapoet.ParameterSpec;
import com.palantir.javapoet.TypeName;
import dev.splitwright.data.Schema;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;

/**
 * How emitted code reads feature {@code f}: {@code x[f]} from one array parameter, or a named
 * parameter per feature. Shared by every layout so their signatures agree.
 */
final class InputAccess {
  private final InputKind kind;
  private final List<String> parameterNames;
  private final boolean bare;

  private InputAccess(InputKind kind, List<String> parameterNames, boolean bare) {
    this.bare = bare;
    this.kind = kind;
    this.parameterNames = parameterNames;
  }

  /**
   * Names a parameter must not take: the other parameters and locals of emitted methods, and
   * restricted identifiers (JLS §3.9) that are legal names but confusing ones.
   */
  private static final List<String> RESERVED = List.of("x", "out", "leaf", "node", "left",
      "i", "j", "c", "v", "at", "var", "yield", "record", "sealed", "permits");

  static InputAccess of(Schema schema, EmitOptions options) {
    if (!options.namedArgs()) {
      return new InputAccess(options.inputKind(), List.of(), options.bare());
    }
    if (schema.featureCount() > EmitOptions.MAX_NAMED_ARGS) {
      throw new EmitLimitException("named-args", "named arguments need at most "
          + EmitOptions.MAX_NAMED_ARGS + " features, but there are " + schema.featureCount(),
          "pass the features as an array (leave out --named-args)");
    }
    Set<String> used = new HashSet<>(RESERVED);
    List<String> params = new ArrayList<>();
    for (int f = 0; f < schema.featureCount(); f++) {
      params.add(Identifiers.parameter(used, schema.feature(f).name()));
    }
    return new InputAccess(options.inputKind(), List.copyOf(params), options.bare());
  }

  /**
   * Tells whether entry methods check the input array's length first: not with named arguments
   * (there is no array) and not in a bare class, where the check's exception and message would
   * weigh about 150 bytes of a few-hundred-byte budget.
   */
  boolean checksLength() {
    return !named() && !bare;
  }

  /** Tells whether the class is bare: no label table, so no {@code label(int)} to point to. */
  boolean bare() {
    return bare;
  }

  boolean named() {
    return !parameterNames.isEmpty();
  }

  InputKind kind() {
    return kind;
  }

  TypeName elementType() {
    return switch (kind) {
      case FLOAT -> TypeName.FLOAT;
      case DOUBLE -> TypeName.DOUBLE;
      case INT -> TypeName.INT;
    };
  }

  /** The expression that reads feature {@code f}. */
  String read(int feature) {
    return named() ? parameterNames.get(feature) : "x[" + feature + "]";
  }

  /** Adds the input parameters to a method. */
  void addParameters(MethodSpec.Builder method) {
    if (named()) {
      for (String name : parameterNames) {
        method.addParameter(ParameterSpec.builder(elementType(), name).build());
      }
    } else {
      method.addParameter(ArrayTypeName.of(elementType()), "x");
    }
  }

  /** An array of the inputs: {@code x}, or {@code new float[] {a, b}} for named parameters. */
  CodeBlock asArray() {
    if (!named()) {
      return CodeBlock.of("x");
    }
    return CodeBlock.of("new $L[] {$L}", elementType(), arguments());
  }

  /**
   * The argument list that passes the inputs on to a helper method; named arguments may wrap
   * between each other, so a call stays within a line.
   */
  CodeBlock arguments() {
    if (!named()) {
      return CodeBlock.of("x");
    }
    CodeBlock.Builder out = CodeBlock.builder();
    for (int p = 0; p < parameterNames.size(); p++) {
      out.add(p == 0 ? "$L" : ",$W$L", parameterNames.get(p));
    }
    return out.build();
  }

  List<String> parameterNames() {
    return parameterNames;
  }

  /**
   * Upper bound of the bytecode bytes of a call that passes the inputs on and returns the int: a
   * load per parameter ({@code xload_n} for local slots 0 to 3, else {@code xload} with a one-byte
   * index; a double takes two slots), {@code invokestatic} (3) and {@code ireturn} (1), JVM
   * Specification §6.5. The bound must be tight: the plan needs room for a split and two calls in
   * a method of the smallest cap.
   */
  int callBytes() {
    int loads = 0;
    if (!named()) {
      loads = 1;
    } else {
      int slot = 0;
      for (int p = 0; p < parameterNames.size(); p++) {
        loads += slot <= 3 ? 1 : slot <= 255 ? 2 : 4;
        slot += kind == InputKind.DOUBLE ? 2 : 1;
      }
    }
    return loads + 3 + 1;
  }
}
