package org.slackwater.core.ingest;

import java.io.IOException;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.TreeSet;
import org.slackwater.core.catalog.StepText;
import org.slackwater.core.cube.LatLonGrid;
import org.slackwater.core.cube.TimeAxis;
import org.slackwater.core.spi.SourceCube;
import org.slackwater.core.spi.SourceException;

/**
 * For a file that is not declared reprocessed: checks that the steps it shares with the cube hold
 * the same values in both (missing where the cube has missing), as when a product re-delivers the
 * last few days with each new day. Values compare exactly, as float32: the same processing gives
 * the same bits, and anything else is a different version of those days, which must be declared.
 *
 * <p>Reads the cube's values one stored band (a chunk's steps by a tile's rows, all columns) at a
 * time and the file's matching steps alongside; memory stays within two bands.
 */
final class OverlapCheck {
  private OverlapCheck() {}

  /** @throws IngestException naming the dates that differ, the first difference, and how to declare a reprocessed file */
  static void requireSameValues(StoredChunks stored, SourceCube file, AppendPlan plan, String cubeName, String where)
      throws IngestException, SourceException, IOException {
    int[] fileSteps = plan.overlapFileSteps();
    int[] cubeSteps = plan.overlapCubeSteps();
    LatLonGrid grid = stored.entry().descriptor().grid();
    TimeAxis axis = stored.entry().descriptor().time();
    int ny = grid.ny();
    int nx = grid.nx();
    int rows = stored.entry().layout().rows();
    int steps = stored.entry().layout().steps();
    float[] band = new float[steps * Math.min(rows, ny) * nx];
    float[] fromFile = new float[Math.min(steps, cubeSteps.length) * Math.min(rows, ny) * nx];
    float[] tile = new float[steps * Math.min(rows, ny) * Math.min(stored.entry().layout().columns(), nx)];
    TreeSet<Integer> differing = new TreeSet<>();
    String first = null;
    for (int y0 = 0; y0 < ny; y0 += rows) {
      int cy = Math.min(rows, ny - y0);
      int p = 0;
      while (p < cubeSteps.length) {
        int t0 = stored.timeChunkStart(cubeSteps[p]);
        stored.readBand(t0, y0, cy, band, tile);
        int end = t0 + stored.stepsIn(t0);
        // Runs of steps consecutive in both the cube and the file are read from the file at once.
        while (p < cubeSteps.length && cubeSteps[p] < end) {
          int q = p + 1;
          while (q < cubeSteps.length && cubeSteps[q] < end && cubeSteps[q] == cubeSteps[q - 1] + 1 && fileSteps[q] == fileSteps[q - 1] + 1) {
            q++;
          }
          file.read(fileSteps[p], q - p, y0, cy, 0, nx, fromFile);
          for (int r = p; r < q; r++) {
            int fileBase = (r - p) * cy * nx;
            int cubeBase = (cubeSteps[r] - t0) * cy * nx;
            for (int c = 0; c < cy * nx; c++) {
              float a = band[cubeBase + c];
              float b = fromFile[fileBase + c];
              if (a != b && !(Float.isNaN(a) && Float.isNaN(b))) {
                if (differing.add(cubeSteps[r]) && first == null) {
                  int y = y0 + c / nx;
                  int x = c % nx;
                  first = String.format(Locale.ROOT, "%s, row %d column %d (latitude %.4f, longitude %.4f): cube %s, file %s",
                      StepText.of(axis.epochSecond(cubeSteps[r])), y, x, grid.latCenter(y), grid.lonCenter(x), text(a), text(b));
                }
                break;
              }
            }
          }
          p = q;
        }
      }
    }
    if (differing.isEmpty()) {
      return;
    }
    List<String> dates = new ArrayList<>();
    for (int s : differing) {
      if (dates.size() == 8) {
        dates.add("...");
        break;
      }
      dates.add(StepText.of(axis.epochSecond(s)));
    }
    throw new IngestException(where + ": " + differing.size() + " of the " + cubeSteps.length + " step(s) it shares with cube '"
        + cubeName + "' hold different values (" + String.join(", ", dates) + "; first difference at " + first
        + "). Nothing was changed. If the file is a reprocessed version of these steps, say so: ingest it with the"
        + " 'reprocessed' option (in the drop folder: put it in reprocessed/), or set the global attribute "
        + IngestOptions.REPROCESSED_ATTRIBUTE + " = \"true\" in the file; otherwise remove these steps from the file");
  }

  private static String text(float v) {
    return Float.isNaN(v) ? "missing" : Float.toString(v);
  }
}
