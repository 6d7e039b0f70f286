package org.slackwater.core.query;

import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Objects;
import org.locationtech.jts.geom.Geometry;
import org.slackwater.core.cube.LatLonGrid;
import org.slackwater.core.region.AreaModel;
import org.slackwater.core.region.CellWeights;
import org.slackwater.core.region.RegionWeights;

/**
 * Region weights per (grid, region outline), least recently used out beyond a fixed number of
 * entries. The key is the outline itself, so a region that is redefined under the same name gets
 * new weights; a new cube version on the same grid reuses them.
 */
public final class WeightsCache {
  /** JTS geometries compare with equalsExact and hash by envelope, so equal outlines share weights. */
  private record Key(LatLonGrid grid, Geometry outline) {}

  private final int capacity;
  private final AreaModel model;
  private final Map<Key, CellWeights> map;

  public WeightsCache(int capacity) {
    this(capacity, AreaModel.SPHERE);
  }

  public WeightsCache(int capacity, AreaModel model) {
    this.capacity = capacity;
    this.model = model;
    this.map = new LinkedHashMap<>(16, 0.75f, true) {
      private static final long serialVersionUID = 1L;

      @Override
      protected boolean removeEldestEntry(Map.Entry<Key, CellWeights> eldest) {
        return size() > WeightsCache.this.capacity;
      }
    };
  }

  public AreaModel model() {
    return model;
  }

  public CellWeights get(LatLonGrid grid, Geometry region) {
    Key key = new Key(Objects.requireNonNull(grid), region);
    synchronized (this) {
      CellWeights w = map.get(key);
      if (w != null) {
        return w;
      }
    }
    CellWeights w = RegionWeights.compute(grid, region, model);
    synchronized (this) {
      map.put(key, w);
    }
    return w;
  }
}
