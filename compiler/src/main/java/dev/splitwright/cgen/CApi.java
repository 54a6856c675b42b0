package dev.splitwright.cgen;

import dev.splitwright.data.Schema;
import java.util.ArrayList;
import java.util.List;

/** The public names of one emitted classifier: files, functions, macros and prototypes. */
final class CApi {
  private final CEmitOptions options;
  private final List<String> featureMacros;
  private final List<String> classMacros;

  private CApi(CEmitOptions options, List<String> featureMacros, List<String> classMacros) {
    this.options = options;
    this.featureMacros = featureMacros;
    this.classMacros = classMacros;
  }

  static CApi of(Schema schema, CEmitOptions options) {
    String p = options.macroPrefix();
    CNames names = new CNames();
    names.reserve(p + "_H");
    names.reserve(p + "_FEATURE_COUNT");
    names.reserve(p + "_CLASS_COUNT");
    List<String> features = new ArrayList<>();
    for (int f = 0; f < schema.featureCount(); f++) {
      features.add(names.macro(p + "_FEATURE_", schema.feature(f).name(), Integer.toString(f)));
    }
    List<String> classes = new ArrayList<>();
    for (int c = 0; c < schema.classCount(); c++) {
      classes.add(names.macro(p + "_CLASS_", schema.classes().get(c), Integer.toString(c)));
    }
    return new CApi(options, List.copyOf(features), List.copyOf(classes));
  }

  String prefix() {
    return options.baseName();
  }

  String macroPrefix() {
    return options.macroPrefix();
  }

  String headerName() {
    return options.baseName() + ".h";
  }

  String sourceName() {
    return options.baseName() + ".c";
  }

  String guard() {
    return options.macroPrefix() + "_H";
  }

  String featureMacro(int feature) {
    return featureMacros.get(feature);
  }

  String classMacro(int classIndex) {
    return classMacros.get(classIndex);
  }

  /** The parameter declaration of the input array. */
  String inputParameter() {
    return "const " + options.elementType() + " x[" + options.macroPrefix() + "_FEATURE_COUNT]";
  }

  String classifySignature() {
    return "int " + prefix() + "_classify(" + inputParameter() + ")";
  }

  String probabilitiesSignature() {
    return "void " + prefix() + "_probabilities(" + inputParameter() + ", float out["
        + options.macroPrefix() + "_CLASS_COUNT])";
  }

  String labelSignature() {
    return "const char *" + prefix() + "_label(int class_index)";
  }

  String featureNameSignature() {
    return "const char *" + prefix() + "_feature_name(int feature_index)";
  }
}
