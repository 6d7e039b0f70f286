package org.slackwater.netcdf;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.slackwater.core.cube.CubeDescriptor;
import org.slackwater.core.cube.LatLonGrid;
import org.slackwater.core.spi.CubeSource;
import org.slackwater.core.spi.SourceCube;
import org.slackwater.core.spi.SourceException;
import org.slackwater.core.time.AlignedTimeAxis;
import org.slackwater.core.time.CfCalendar;
import org.slackwater.core.time.CfTimeDecoder;
import org.slackwater.core.time.CfTimeUnits;
import ucar.ma2.Array;
import ucar.ma2.DataType;
import ucar.nc2.Attribute;
import ucar.nc2.NetcdfFile;
import ucar.nc2.Variable;

/**
 * Reads CF-NetCDF files (classic, 64-bit offset, CDF-5 and NetCDF-4) into cubes.
 *
 * <p>A cube variable has dimensions (time, lat, lon) with 1-D coordinate variables: time
 * recognised by units {@code <unit> since <date>}, standard_name {@code time} or axis {@code T};
 * latitude and longitude by units {@code degrees_north}/{@code degrees_east}, standard_name or
 * axis {@code Y}/{@code X}. The file is opened with {@code NetcdfFile.open}, not as an enhanced
 * dataset: the CF work (packing, missing values, time, units, orientation) is done here once,
 * see {@link ValueDecoder}, {@link CfTimeDecoder}, {@link CanonicalUnits} and {@link
 * AxisNormaliser}.
 *
 * <p>Descriptor attributes keep provenance: global attributes as {@code :title}, {@code :history},
 * {@code :source}, {@code :Conventions}, {@code :references}, {@code :comment}; variable
 * attributes as {@code <variable>:cell_methods} and {@code <variable>:comment}; and what this
 * source did, under {@code slackwater.file}, {@code slackwater.units}, {@code slackwater.packing},
 * {@code slackwater.latitude}, {@code slackwater.longitude}, {@code slackwater.time}.
 *
 * <p>Loading this class sets NetCDF-Java's JVM-wide {@code N3header.disallowFileTruncation}, so
 * that truncated classic files fail instead of being padded.
 *
 * <p>Failure modes: every problem is a {@link SourceException} whose message names the file, the
 * variable where there is one, what is wrong and how to fix it; no NetCDF-Java or I/O exception
 * escapes unwrapped.
 */
public final class NetCdfCubeSource implements CubeSource {

  private static final int BUFFER_SIZE = 1 << 18;
  private static final String[] GLOBAL_PROVENANCE = {"title", "history", "source", "Conventions", "references", "comment",
      "slackwater_reprocessed"};
  private static final String[] VARIABLE_PROVENANCE = {"cell_methods", "comment"};

  static {
    // NetCDF-Java's classic reader otherwise pads a truncated file with whatever lies past its end
    // (it only logs a warning), so short files would deliver invented values. This is a JVM-wide
    // NetCDF-Java setting; strictness is what any reader of ours wants.
    ucar.nc2.iosp.netcdf3.N3header.disallowFileTruncation = true;
  }

  public NetCdfCubeSource() {}

  @Override
  public String name() {
    return "netcdf";
  }

  @Override
  public boolean accepts(Path file) {
    return NetCdfMagic.matches(file);
  }

  @Override
  public List<String> variables(Path file) throws SourceException {
    try (NetcdfFile nc = openFile(file)) {
      List<String> names = new ArrayList<>();
      List<String> reasons = new ArrayList<>();
      for (Variable v : nc.getVariables()) {
        String why = CubeLayout.whyNot(nc, v);
        if (why == null) {
          names.add(v.getShortName());
        } else if (!why.startsWith("it is a") && !isCoordinateLike(nc, v)) {
          reasons.add("'" + v.getShortName() + "': " + why);
        }
      }
      if (names.isEmpty()) {
        throw new SourceException("file " + label(file) + ": holds no variable that can be read as a cube (a grid on 1-D latitude and longitude with a time axis)"
            + (reasons.isEmpty() ? "; it has no data variables" : " (" + String.join("; ", reasons) + ")"));
      }
      return List.copyOf(names);
    } catch (IOException | RuntimeException e) {
      throw unreadable(file, e);
    }
  }

  @Override
  public SourceCube open(Path file, String variable) throws SourceException {
    NetcdfFile nc = openFile(file);
    String where = "file " + label(file) + ", variable " + variable;
    try {
      Variable v = nc.findVariable(NetcdfFile.makeValidPathName(variable));
      if (v == null) {
        throw new SourceException(where + ": no such variable; the file holds " + available(nc));
      }
      return build(file, nc, v, where);
    } catch (Problem p) {
      closeQuietly(nc);
      throw new SourceException(where + ": " + p.getMessage(), p);
    } catch (SourceException e) {
      closeQuietly(nc);
      throw e;
    } catch (IOException | RuntimeException e) {
      closeQuietly(nc);
      throw new SourceException(where + ": cannot be read (" + describe(e, file) + "); the file may be truncated or corrupt;"
          + " write it again or fetch a fresh copy", e);
    }
  }

  private static SourceCube build(Path file, NetcdfFile nc, Variable v, String where) throws Problem, IOException {
    CubeLayout layout = CubeLayout.of(nc, v);
    AlignedTimeAxis time = time(layout.time());
    NormalisedAxis lat = AxisNormaliser.latitude(layout.lat().getShortName(), coordinate(layout.lat()), bounds(nc, layout.lat()));
    NormalisedAxis lon = AxisNormaliser.longitude(layout.lon().getShortName(), coordinate(layout.lon()), bounds(nc, layout.lon()));
    LatLonGrid grid;
    try {
      grid = new LatLonGrid(lat.lower(), lat.upper(), lon.lower(), lon.upper());
    } catch (IllegalArgumentException e) {
      throw new Problem("its grid is not a regular lat/lon grid: " + e.getMessage() + "; fix the coordinate bounds (CF 7.1)");
    }
    String declared = Attributes.textOrEmpty(v, "units");
    String standardName = Attributes.textOrEmpty(v, "standard_name");
    String longName = Attributes.textOrEmpty(v, "long_name");
    LinearConversion units = CanonicalUnits.resolve(declared, standardName, longName + " " + v.getShortName());
    ValueDecoder decoder = ValueDecoder.of(v, units);

    Map<String, String> attributes = new LinkedHashMap<>();
    for (String name : GLOBAL_PROVENANCE) {
      Attribute a = nc.findGlobalAttribute(name);
      if (a != null) {
        attributes.put(":" + name, Attributes.describe(a));
      }
    }
    for (String name : VARIABLE_PROVENANCE) {
      Attribute a = v.findAttribute(name);
      if (a != null) {
        attributes.put(v.getShortName() + ":" + name, Attributes.describe(a));
      }
    }
    attributes.put("slackwater.file", String.valueOf(file.getFileName()));
    attributes.put("slackwater.units", units.describe(declared));
    putIfNotEmpty(attributes, "slackwater.packing", decoder.description());
    putIfNotEmpty(attributes, "slackwater.latitude", lat.note());
    putIfNotEmpty(attributes, "slackwater.longitude", lon.note());
    int dropped = time.droppedCount(layout.time().getShape(0));
    attributes.put("slackwater.time", "calendar " + time.axis().calendar() + " placed on real instants by "
        + time.axis().alignment() + (dropped == 0 ? "" : "; " + dropped + " step(s) without a real date dropped"));

    CubeDescriptor descriptor = new CubeDescriptor(v.getShortName(), standardName, longName, units.unit(), declared,
        grid, time.axis(), attributes);
    return new NetCdfSourceCube(nc, file, v, where, descriptor, time.sourceIndices(), lat.fileIndex(), lon.fileIndex(), decoder);
  }

  private static AlignedTimeAxis time(Variable t) throws Problem, IOException {
    String name = "time variable '" + t.getShortName() + "'";
    String unitsText = Attributes.text(t, "units");
    if (unitsText == null) {
      throw new Problem(name + " has no units; add units such as 'days since 2000-01-01' (CF 4.4)");
    }
    CfTimeUnits units;
    CfCalendar calendar;
    try {
      units = CfTimeUnits.parse(unitsText);
      calendar = CfCalendar.parse(Attributes.text(t, "calendar"));
      return CfTimeDecoder.toTimeAxis(coordinate(t), units, calendar);
    } catch (IllegalArgumentException e) {
      throw new Problem(name + ": " + e.getMessage(), e);
    }
  }

  /** A 1-D coordinate as doubles: floats widened to the decimal they print as, packing applied. */
  private static double[] coordinate(Variable c) throws IOException, Problem {
    if (!c.getDataType().isNumeric()) {
      throw new Problem("coordinate variable '" + c.getShortName() + "' holds " + c.getDataType() + " values, not numbers");
    }
    Array a = c.read();
    double[] out = new double[(int) a.getSize()];
    boolean isFloat = c.getDataType() == DataType.FLOAT;
    for (int i = 0; i < out.length; i++) {
      out[i] = isFloat ? Double.parseDouble(Float.toString(a.getFloat(i))) : a.getDouble(i);
    }
    double scale = Attributes.number(c, "scale_factor", 1);
    double offset = Attributes.number(c, "add_offset", 0);
    if (scale != 1 || offset != 0) {
      for (int i = 0; i < out.length; i++) {
        out[i] = out[i] * scale + offset;
      }
    }
    return out;
  }

  /** The CF 7.1 bounds of a 1-D coordinate as {lower0, upper0, lower1, ...}, or null if it has none. */
  private static double[] bounds(NetcdfFile nc, Variable c) throws IOException, Problem {
    String name = Attributes.text(c, "bounds");
    if (name == null) {
      return null;
    }
    Variable b = nc.findVariable(NetcdfFile.makeValidPathName(name));
    if (b == null) {
      throw new Problem("coordinate '" + c.getShortName() + "' names bounds variable '" + name
          + "', which the file lacks; add it or remove the bounds attribute (CF 7.1)");
    }
    if (b.getRank() != 2 || b.getShape(1) != 2 || b.getShape(0) != c.getShape(0)) {
      throw new Problem("bounds variable '" + name + "' has shape (" + b.getDimensionsString().replace(" ", ", ")
          + "); a 1-D coordinate of " + c.getShape(0) + " cells needs (" + c.getShape(0) + ", 2) (CF 7.1)");
    }
    return coordinate(b);
  }

  /** Coordinates (also 2-D or auxiliary ones) are not worth a reason in the "no cube" message. */
  private static boolean isCoordinateLike(NetcdfFile nc, Variable v) {
    if (AxisRecognizer.isLatitude(v) || AxisRecognizer.isLongitude(v) || AxisRecognizer.isTime(v)) {
      return true;
    }
    for (Variable other : nc.getVariables()) {
      String coordinates = Attributes.text(other, "coordinates");
      if (coordinates != null && List.of(coordinates.split("\\s+")).contains(v.getShortName())) {
        return true;
      }
    }
    return false;
  }

  private static String available(NetcdfFile nc) {
    List<String> cubes = new ArrayList<>();
    List<String> all = new ArrayList<>();
    for (Variable v : nc.getVariables()) {
      all.add(v.getShortName());
      if (CubeLayout.whyNot(nc, v) == null) {
        cubes.add(v.getShortName());
      }
    }
    if (!cubes.isEmpty()) {
      return "these gridded variables: " + String.join(", ", cubes);
    }
    return all.isEmpty() ? "no variables" : "no gridded variable with a time axis, only " + String.join(", ", all);
  }

  /** Opens without enhancement; refuses files that do not start like NetCDF before NetCDF-Java sees them. */
  private static NetcdfFile openFile(Path file) throws SourceException {
    if (!Files.isRegularFile(file)) {
      throw new SourceException("file " + label(file) + ": does not exist or is not a regular file; check the path");
    }
    byte[] head = NetCdfMagic.head(file);
    if (head == null) {
      throw new SourceException("file " + label(file) + ": cannot be read; check its permissions");
    }
    if (!NetCdfMagic.matches(head)) {
      throw new SourceException("file " + label(file) + ": not a NetCDF file (it starts with " + NetCdfMagic.show(head)
          + ", not 'CDF' or '\\211HDF'); give a NetCDF-3 or NetCDF-4 file");
    }
    try {
      return NetcdfFile.open(file.toString(), BUFFER_SIZE, null);
    } catch (IOException | RuntimeException e) {
      throw unreadable(file, e);
    }
  }

  private static SourceException unreadable(Path file, Exception e) {
    return new SourceException("file " + label(file) + ": cannot be read as NetCDF (" + describe(e, file)
        + "); the file may be truncated or corrupt; write it again or fetch a fresh copy", e);
  }

  /** The file's name only: messages travel to HTTP clients, who must not learn the server's directories. */
  static String label(Path file) {
    return file.getFileName() == null ? file.toString() : file.getFileName().toString();
  }

  private static final java.util.regex.Pattern TRUNCATED =
      java.util.regex.Pattern.compile(".*truncated calculated size= ?(\\d+) actual = ?(\\d+).*", java.util.regex.Pattern.DOTALL);

  /** NetCDF-Java's failure in plain words, without class names or machine paths. */
  static String describe(Exception e, Path file) {
    String m = e.getMessage() == null ? "" : e.getMessage();
    java.util.regex.Matcher t = TRUNCATED.matcher(m);
    if (t.matches()) {
      return "it is " + t.group(2) + " bytes long but its header describes " + t.group(1) + " bytes: it was cut short";
    }
    if (e instanceof java.io.EOFException) {
      return "it ends before the data its header describes";
    }
    if (m.isBlank()) {
      return "the NetCDF library gave no reason";
    }
    return m.replace(file.toAbsolutePath().toString(), label(file)).replace(file.toString(), label(file));
  }

  private static void putIfNotEmpty(Map<String, String> map, String key, String value) {
    if (!value.isEmpty()) {
      map.put(key, value);
    }
  }

  private static void closeQuietly(NetcdfFile nc) {
    try {
      nc.close();
    } catch (IOException | RuntimeException ignored) {
      // the open failure is the message worth reporting
    }
  }
}
