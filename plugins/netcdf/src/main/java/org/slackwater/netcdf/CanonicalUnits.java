package org.slackwater.netcdf;

import java.util.Locale;
import java.util.Set;
import ucar.units.ConversionException;
import ucar.units.DerivedUnit;
import ucar.units.Factor;
import ucar.units.Unit;
import ucar.units.UnitFormat;
import ucar.units.UnitFormatManager;
import ucar.units.UnknownUnit;

/**
 * The table of canonical units: which declared units are converted, to what, and by which linear
 * formula. Parsing and conversion factors come from udunits ({@code ucar.units} in cdm 4.5.5).
 *
 * <ul>
 *   <li>temperature (K, degC, degF, ...) to {@code degC}; a standard_name naming an anomaly or
 *       difference converts by the scale only (1 K of anomaly is 1 degC, not -272.15 degC);
 *   <li>water fluxes to {@code mm/day}: a mass flux ({@code kg m-2 s-1}, ...) times 86,400 s/day,
 *       taking fresh water at 1000 kg m-3 so that 1 kg m-2 is a 1 mm layer; a length per time
 *       ({@code mm h-1}, {@code m s-1}, ...) by udunits, but only when the standard_name (or, lacking
 *       one, the long_name) says it is precipitation, rain or runoff, so that current speeds stay
 *       as declared. A mass flux whose standard_name names something else (e.g. a carbon flux)
 *       stays as declared;
 *   <li>mass concentration (mg m-3, ug L-1, g m-3, ...) to {@code mg m-3}, unless a standard_name
 *       or name says density;
 *   <li>the fraction spellings {@code 1}, {@code %} and {@code percent} to {@code 1}; a
 *       standard_name ending in {@code _fraction} converts any dimensionless unit to {@code 1};
 *   <li>turbidity {@code FNU}, {@code NTU}, {@code FTU} kept as declared (not udunits units);
 *   <li>anything else udunits reads is kept as declared.
 * </ul>
 *
 * <p>Failure modes ({@link Problem}): units udunits cannot read; a standard_name whose
 * quantity is in the table with units of another quantity, or with no units at all.
 *
 * <p>Thread-safe: the udunits parser is shared and used under a lock.
 */
final class CanonicalUnits {

  private static final Set<String> TURBIDITY = Set.of("FNU", "NTU", "FTU");
  private static final Set<String> FRACTION_SPELLINGS = Set.of("1", "%", "percent");
  /** Fresh water: 1 kg m-2 of water is a 1 mm layer, so kg m-2 s-1 times seconds per day is mm/day. */
  private static final double SECONDS_PER_DAY = 86_400;
  private static final Object LOCK = new Object();

  private CanonicalUnits() {}

  /**
   * How to deliver values declared in {@code declared}.
   *
   * @param declared the units attribute (null or blank if absent)
   * @param standardName the standard_name attribute, or null
   * @param description long_name and variable name, used only to recognise precipitation and
   *     density when no standard_name says so
   */
  static LinearConversion resolve(String declared, String standardName, String description) throws Problem {
    Quantity named = Quantity.ofStandardName(standardName);
    String units = declared == null ? "" : declared.trim();
    if (units.isEmpty()) {
      if (named != null) {
        throw new Problem("units are missing, but standard_name '" + standardName.trim() + "' needs "
            + named.expected() + "; add a units attribute");
      }
      return LinearConversion.identity("");
    }
    if (TURBIDITY.contains(units.toUpperCase(Locale.ROOT))) {
      if (named != null) {
        throw mismatch(units, standardName, named);
      }
      return LinearConversion.identity(units);
    }
    Unit unit = parse(units);
    Quantity quantity = named != null ? named : byUnits(unit, units, standardName, description);
    if (quantity == null) {
      return LinearConversion.identity(units);
    }
    try {
      return switch (quantity) {
        case TEMPERATURE -> affine(unit, "degC", false, "");
        case TEMPERATURE_DIFFERENCE -> affine(unit, "degC", true, "temperature difference: scale only");
        case MASS_CONCENTRATION -> affine(unit, "mg m-3", false, "");
        case FRACTION -> affine(unit, "1", false, "");
        case WATER_FLUX -> waterFlux(unit);
      };
    } catch (ConversionException e) {
      throw mismatch(units, standardName, quantity);
    }
  }

  /** The quantity the units alone imply, or null to keep them. */
  private static Quantity byUnits(Unit unit, String units, String standardName, String description) {
    boolean hasStandardName = standardName != null && !standardName.isBlank();
    String text = ((hasStandardName ? standardName : "") + " " + (description == null ? "" : description))
        .toLowerCase(Locale.ROOT);
    if (unit.isCompatible(reference("K"))) {
      return Quantity.TEMPERATURE;
    }
    if (unit.isCompatible(reference("kg m-2 s-1"))) {
      return hasStandardName ? null : Quantity.WATER_FLUX;
    }
    if (unit.isCompatible(reference("mm/day"))) {
      return text.contains("precip") || text.contains("rain") || text.contains("runoff") ? Quantity.WATER_FLUX : null;
    }
    if (unit.isCompatible(reference("mg m-3"))) {
      return text.contains("density") || (hasStandardName && !standardName.contains("concentration"))
          ? null : Quantity.MASS_CONCENTRATION;
    }
    if (FRACTION_SPELLINGS.contains(units.toLowerCase(Locale.ROOT))) {
      return Quantity.FRACTION;
    }
    return null;
  }

  private static LinearConversion waterFlux(Unit unit) throws ConversionException {
    if (unit.isCompatible(reference("kg m-2 s-1"))) {
      LinearConversion toSi = affine(unit, "kg m-2 s-1", false, "");
      return new LinearConversion("mm/day", toSi.scale() * SECONDS_PER_DAY, 0,
          "mass flux of fresh water, 1000 kg m-3: 1 kg m-2 = 1 mm");
    }
    return affine(unit, "mm/day", false, "");
  }

  /** The linear map from {@code unit} to {@code target}, read off udunits' converter. */
  private static LinearConversion affine(Unit unit, String target, boolean scaleOnly, String note) throws ConversionException {
    double at0;
    double at1;
    double at2;
    synchronized (LOCK) {
      var c = unit.getConverterTo(reference(target));
      at0 = c.convert(0.0);
      at1 = c.convert(1.0);
      at2 = c.convert(2.0);
    }
    double scale = at1 - at0;
    double offset = scaleOnly ? 0 : at0;
    if (Math.abs(at2 - (2 * scale + at0)) > 1e-9 * Math.max(1, Math.abs(at2))) {
      throw new ConversionException(unit, reference(target)); // not linear: a logarithmic unit
    }
    // udunits' factors carry binary noise (ug L-1 -> mg m-3 gives 1.0000000000000002).
    return new LinearConversion(target, round(scale), round(offset), note);
  }

  private static double round(double v) {
    if (v == 0) {
      return 0;
    }
    return Double.parseDouble(String.format(Locale.ROOT, "%.15g", v));
  }

  private static Problem mismatch(String units, String standardName, Quantity quantity) {
    return new Problem("units '" + units + "' do not fit standard_name '" + standardName.trim() + "', which needs "
        + quantity.expected() + "; correct the units or the standard_name");
  }

  private static Unit reference(String spec) {
    try {
      return parseRaw(spec);
    } catch (Exception e) {
      throw new IllegalStateException("udunits cannot read its own reference unit '" + spec + "'", e);
    }
  }

  /**
   * Parses with udunits. Unknown symbols come back from udunits as an {@link UnknownUnit} rather
   * than an error, so those count as not understood too.
   */
  static Unit parse(String units) throws Problem {
    String spec = units.replace('\u00b5', 'u').replace('\u03bc', 'u');
    Unit unit;
    try {
      unit = parseRaw(spec);
    } catch (Exception e) {
      unit = null;
    }
    if (unit == null || hasUnknownFactor(unit)) {
      throw new Problem("units '" + units + "' are not understood; write a udunits string such as 'K' or 'mg m-3'");
    }
    return unit;
  }

  private static Unit parseRaw(String spec) throws Exception {
    UnitFormat format = UnitFormatManager.instance();
    synchronized (LOCK) {
      return format.parse(spec);
    }
  }

  private static boolean hasUnknownFactor(Unit unit) {
    if (unit instanceof UnknownUnit) {
      return true;
    }
    DerivedUnit derived;
    try {
      derived = unit.getDerivedUnit();
    } catch (RuntimeException e) {
      return false; // time-scale units ("days since ...") have no derived form; udunits read them
    }
    if (derived == null) {
      return false;
    }
    for (Factor f : derived.getDimension().getFactors()) {
      if (f.getBase() instanceof UnknownUnit) {
        return true;
      }
    }
    return false;
  }
}
