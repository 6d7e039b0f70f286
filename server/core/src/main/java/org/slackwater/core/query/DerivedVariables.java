package org.slackwater.core.query;

import java.io.IOException;
import java.time.Instant;
import java.util.ArrayList;
import java.util.BitSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.slackwater.core.analytics.ChunkSource;
import org.slackwater.core.analytics.UnitAlgebra;
import org.slackwater.core.catalog.Catalog;
import org.slackwater.core.catalog.CubeEntry;
import org.slackwater.core.catalog.Provenance;
import org.slackwater.core.cube.CubeDescriptor;
import org.slackwater.core.cube.Footprint;
import org.slackwater.core.result.Column;
import org.slackwater.core.result.ResultTable;
import org.slackwater.core.store.ChunkRecord;
import org.slackwater.query.QueryException;
import org.slackwater.query.QueryPrinter;
import org.slackwater.query.ast.BinaryOp;
import org.slackwater.query.ast.DerivedVariable;
import org.slackwater.query.ast.Expression;
import org.slackwater.query.ast.Negate;
import org.slackwater.query.ast.NumberLiteral;
import org.slackwater.query.ast.VariableRef;

/**
 * The derived variables of one request ({@code let NAME = expression [in unit]}): cell-by-cell
 * arithmetic on cubes and quantities with units, usable as a variable by the later statements of
 * the same request. Units follow {@link UnitAlgebra}: sums and differences need the same quantity
 * (the right side is converted to the left's unit), products and quotients multiply units, and
 * units udunits does not know (FNU) are carried as symbols, so a site line {@code 1.3 mg/L/FNU *
 * turbidity + 2.1 mg/L} comes out in mg/L. A missing input value makes the result missing.
 *
 * <p>The derived variable lives on the grid, time axis and chunking of the first variable of its
 * expression. Inputs on another grid, time axis or chunking are brought onto those by {@link
 * RegriddedInput} (conservative regridding in space, same instants in time); an input that shares
 * no area or no time step with the first is refused with a clear message. Values are computed
 * chunk by chunk when an operator asks for them ({@link #chunks}); nothing is stored.
 */
final class DerivedVariables {

  /** A compiled expression over the chunk values of the inputs. */
  private sealed interface Node permits Input, Constant, Unary, Binary {}

  private record Input(String cube, double scale, double offset) implements Node {}

  private record Constant(double value) implements Node {}

  private record Unary(Node operand) implements Node {}

  private record Binary(Node left, char op, Node right) implements Node {}

  /** A compiled node, its unit, and the unit as the user would read it in messages. */
  private record Typed(Node node, UnitAlgebra unit, String shown) {}

  private record Derived(CubeEntry entry, Node root, List<CubeEntry> inputs, Map<String, RegriddedInput> regridded) {}

  private final Catalog catalog;
  private final String source;
  private final Map<String, Derived> derived = new LinkedHashMap<>();

  DerivedVariables(Catalog catalog, String source) {
    this.catalog = catalog;
    this.source = source;
  }

  /** The cube a name refers to in this request: a derived variable first, then the catalog. */
  Optional<CubeEntry> cube(String name) {
    Derived d = derived.get(name);
    return d != null ? Optional.of(d.entry()) : catalog.cube(name);
  }

  List<String> names() {
    return List.copyOf(derived.keySet());
  }

  ResultTable define(DerivedVariable let) {
    String name = let.name().name();
    if (catalog.cube(name).isPresent()) {
      throw QueryException.at(let.name(), source, "'" + name + "' is already a stored variable", "choose another name for the derived variable");
    }
    List<CubeEntry> inputs = new ArrayList<>();
    Typed t = compile(let.expression(), inputs);
    if (inputs.isEmpty()) {
      throw QueryException.at(let.expression(), source, "a derived variable needs at least one variable in its expression", "");
    }
    Node root = t.node();
    UnitAlgebra unit = t.unit();
    String unitText = displayName(unit, let.expression(), inputs);
    if (let.unit().isPresent()) {
      UnitAlgebra want;
      try {
        want = UnitAlgebra.parse(let.unit().get().unit());
      } catch (IllegalArgumentException e) {
        throw QueryException.at(let.unit().get(), source, e.getMessage(), "");
      }
      double[] c;
      try {
        c = unit.conversionTo(want);
      } catch (IllegalArgumentException e) {
        throw QueryException.at(let.unit().get(), source, "the expression's unit '" + unit + "' cannot be expressed in '"
            + let.unit().get().unit() + "'", "check the units of the constants");
      }
      root = new Binary(new Binary(root, '*', new Constant(c[0])), '+', new Constant(c[1]));
      unitText = let.unit().get().unit();
    }
    CubeEntry first = inputs.get(0);
    Map<String, RegriddedInput> regridded = new LinkedHashMap<>();
    BitSet present = first.footprint().present();
    for (CubeEntry in : inputs) {
      if (RegriddedInput.aligned(first, in)) {
        present.and(in.footprint().present());
      } else {
        RegriddedInput ri = regridded.computeIfAbsent(in.name(), k -> RegriddedInput.onto(first, in));
        present.and(ri.footprint());
      }
    }
    CubeDescriptor d = first.descriptor();
    String text = QueryPrinter.print(let);
    CubeDescriptor desc = new CubeDescriptor(name, "", text, unitText, unit.toString(), d.grid(), d.time(), Map.of("derived_from", text));
    CubeEntry entry = new CubeEntry(name, 1, desc, first.layout(), first.chunks(), new Footprint(d.grid().cells(), present),
        new Provenance("(derived in the request)", "", text, "derived", Instant.EPOCH));
    derived.put(name, new Derived(entry, root, List.copyOf(inputs), Map.copyOf(regridded)));
    String onto = regridded.isEmpty() ? "" : String.join(", ", regridded.keySet()) + " (conservatively onto the grid and steps of " + first.name() + ")";
    Map<String, String> meta = new LinkedHashMap<>();
    meta.put("query", source);
    meta.put(DEFINITION, "yes");
    meta.put("grid_of", first.name());
    return new ResultTable("derived variable " + name, List.of(
        new Column.Strings("variable", new String[] {name}), new Column.Strings("units", new String[] {unitText}),
        new Column.Strings("definition", new String[] {text}),
        new Column.Strings("inputs", new String[] {String.join(", ", inputs.stream().map(CubeEntry::name).distinct().toList())}),
        new Column.Strings("regridded", new String[] {onto})),
        meta, List.of());
  }

  /** Metadata key marking a result that only reports a definition (CSV leaves these out). */
  static final String DEFINITION = "definition_only";

  /** The unit as the user wrote it somewhere in the expression if one matches exactly (mg/L), else udunits' form. */
  private static String displayName(UnitAlgebra unit, Expression e, List<CubeEntry> inputs) {
    List<String> written = new ArrayList<>();
    collectUnits(e, written);
    inputs.forEach(c -> written.add(c.descriptor().units()));
    for (String w : written) {
      try {
        double[] c = unit.conversionTo(UnitAlgebra.parse(w));
        if (Math.abs(c[0] - 1) < 1e-12 && c[1] == 0) {
          return w;
        }
      } catch (IllegalArgumentException ignored) {
        // Not this one.
      }
    }
    return unit.toString();
  }

  private static void collectUnits(Expression e, List<String> out) {
    if (e instanceof NumberLiteral n) {
      n.unit().ifPresent(u -> out.add(u.unit()));
    } else if (e instanceof Negate n) {
      collectUnits(n.operand(), out);
    } else if (e instanceof BinaryOp b) {
      collectUnits(b.left(), out);
      collectUnits(b.right(), out);
    }
  }

  private Typed compile(Expression e, List<CubeEntry> inputs) {
    if (e instanceof NumberLiteral n) {
      UnitAlgebra u;
      try {
        u = n.unit().map(r -> UnitAlgebra.parse(r.unit())).orElse(UnitAlgebra.ONE);
      } catch (IllegalArgumentException ex) {
        throw QueryException.at(n, source, ex.getMessage(), "");
      }
      return new Typed(new Constant(n.value()), u, n.unit().map(x -> x.unit()).orElse("1"));
    }
    if (e instanceof VariableRef v) {
      CubeEntry c = cube(v.variable().name()).orElseThrow(() -> SeriesPlanner.unknownVariable(catalog, v.variable(), source));
      if (!inputs.isEmpty() && !RegriddedInput.aligned(inputs.get(0), c)) {
        try {
          RegriddedInput.onto(inputs.get(0), c);
        } catch (IllegalArgumentException ex) {
          throw QueryException.at(v, source, ex.getMessage(),
              "a derived variable lives on the grid and steps of the first variable of its expression; the others must overlap it");
        }
      }
      inputs.add(c);
      UnitAlgebra u;
      try {
        u = UnitAlgebra.parse(c.descriptor().units());
      } catch (IllegalArgumentException ex) {
        throw QueryException.at(v, source, "the unit of " + c.name() + " cannot be used in arithmetic: " + ex.getMessage(), "");
      }
      return new Typed(new Input(c.name(), 1, 0), u, c.descriptor().units());
    }
    if (e instanceof Negate n) {
      Typed t = compile(n.operand(), inputs);
      return new Typed(new Unary(t.node()), t.unit(), t.shown());
    }
    BinaryOp b = (BinaryOp) e;
    Typed l = compile(b.left(), inputs), r = compile(b.right(), inputs);
    return switch (b.operator()) {
      case ADD, SUBTRACT -> {
        double[] c;
        try {
          c = r.unit().conversionTo(l.unit());
        } catch (IllegalArgumentException ex) {
          throw QueryException.at(b, source, "cannot " + (b.operator().name().equals("ADD") ? "add" : "subtract") + " '" + r.shown()
              + "' " + (b.operator().name().equals("ADD") ? "to" : "from") + " '" + l.shown() + "'", "both sides of + and - need the same kind of quantity");
        }
        Node right = c[0] == 1 && c[1] == 0 ? r.node() : new Binary(new Binary(r.node(), '*', new Constant(c[0])), '+', new Constant(c[1]));
        yield new Typed(new Binary(l.node(), b.operator().name().equals("ADD") ? '+' : '-', right), l.unit(), l.shown());
      }
      case MULTIPLY -> new Typed(new Binary(l.node(), '*', r.node()), l.unit().multiply(r.unit()), shownProduct(l.shown(), " ", r.shown()));
      case DIVIDE -> new Typed(new Binary(l.node(), '/', r.node()), l.unit().divide(r.unit()), shownProduct(l.shown(), "/", r.shown()));
    };
  }

  private static String shownProduct(String a, String op, String b) {
    if (b.equals("1")) {
      return a;
    }
    if (a.equals("1") && op.equals(" ")) {
      return b;
    }
    return "(" + a + ")" + op + "(" + b + ")";
  }

  /** Chunk values of stored cubes from {@code base}; of derived variables computed from their inputs. */
  ChunkSource chunks(ChunkSource base) {
    if (derived.isEmpty()) {
      return base;
    }
    return new ChunkSource() {
      @Override
      public float[] get(CubeEntry cube, ChunkRecord chunk) throws IOException {
        Derived d = derived.get(cube.name());
        if (d == null || !"derived".equals(cube.provenance().reader())) {
          return base.get(cube, chunk);
        }
        Map<String, float[]> values = new LinkedHashMap<>();
        for (CubeEntry in : d.inputs()) {
          RegriddedInput ri = d.regridded().get(in.name());
          if (ri != null && !values.containsKey(in.name())) {
            values.put(in.name(), ri.values(chunk.key(), this));
          } else if (!values.containsKey(in.name())) {
            ChunkRecord same = in.chunks().stream().filter(c -> c.key().equals(chunk.key())).findFirst()
                .orElseThrow(() -> new IOException("input " + in.name() + " lacks chunk " + chunk.key()));
            values.put(in.name(), get(in, same));
          }
        }
        int n = chunk.key().values();
        float[] out = new float[n];
        for (int i = 0; i < n; i++) {
          out[i] = (float) eval(d.root(), values, i);
        }
        return out;
      }
    };
  }

  private static double eval(Node node, Map<String, float[]> values, int i) {
    if (node instanceof Input in) {
      return values.get(in.cube())[i];
    }
    if (node instanceof Constant c) {
      return c.value();
    }
    if (node instanceof Unary u) {
      return -eval(u.operand(), values, i);
    }
    Binary b = (Binary) node;
    double l = eval(b.left(), values, i), r = eval(b.right(), values, i);
    return switch (b.op()) {
      case '+' -> l + r;
      case '-' -> l - r;
      case '*' -> l * r;
      default -> l / r;
    };
  }
}
