package org.slackwater.demo;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

/**
 * The files one {@link DemoScenario#generate} call wrote, all inside {@code dir}.
 *
 * <p>{@code netcdfFiles} is in a fixed order: rainfall, runoff, water temperature, cloud fraction,
 * turbidity, chlorophyll. The list is copied, so the manifest is immutable.
 */
public record DemoManifest(Path dir, List<Path> netcdfFiles, Path regions, Path stations, Path groundTruth) {

  /** File name of the README written beside the data, explaining the CSV columns. */
  public static final String README_NAME = "README.md";

  public DemoManifest {
    netcdfFiles = List.copyOf(netcdfFiles);
  }

  /** The README written into {@code dir}. */
  public Path readme() {
    return dir.resolve(README_NAME);
  }

  /** Every file written, NetCDF first, then regions, stations, ground truth and README. */
  public List<Path> allFiles() {
    List<Path> all = new ArrayList<>(netcdfFiles);
    all.add(regions);
    all.add(stations);
    all.add(groundTruth);
    all.add(readme());
    return List.copyOf(all);
  }
}
