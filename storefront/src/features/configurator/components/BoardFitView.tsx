import Box from '@mui/joy/Box';
import List from '@mui/joy/List';
import ListItem from '@mui/joy/ListItem';
import Typography from '@mui/joy/Typography';
import type { BoardFit, Catalog } from '@loomwright/shared';
import { BoardSketch } from './BoardSketch';
import { CheckStatusChip } from './CheckStatus';

export function BoardFitView({ fit, catalog }: { fit: BoardFit; catalog: Catalog }) {
  const surface = catalog.surfaces.find((s) => s.id === fit.surfaceId);
  const suggestion = fit.smallestFittingSurfaceId ? catalog.surfaces.find((s) => s.id === fit.smallestFittingSurfaceId) : undefined;
  return (
    <Box>
      <Box sx={{ display: 'flex', alignItems: 'center', gap: 1, flexWrap: 'wrap' }}>
        <Typography level="title-md" component="h3">
          Board fit
        </Typography>
        <CheckStatusChip status={fit.status} />
      </Box>
      <Typography level="body-sm" sx={{ mt: 0.5, mb: 1.5, fontVariantNumeric: 'tabular-nums' }}>
        The pedals with room to patch between them take {Math.round(fit.fillRatio * 100)}% of the {surface?.name ?? 'surface'}’s usable area
        ({fit.usableWidthMm} × {fit.usableDepthMm} mm). {fit.layoutFits ? 'They fit in simple rows.' : 'They do not fit in simple rows.'}
        {!fit.layoutFits && suggestion && suggestion.id !== fit.surfaceId
          ? ` The smallest surface that holds them is the ${suggestion.name} (${suggestion.widthMm} × ${suggestion.depthMm} mm).`
          : ''}
      </Typography>
      <BoardSketch fit={fit} surfaceName={surface?.name ?? 'surface'} />
      {fit.unplaced.length || fit.warnings.length ? (
        <List size="sm" marker="disc" sx={{ mt: 1, pl: 2, '--List-padding': '0' }}>
          {fit.unplaced.length ? <ListItem>No room for: {fit.unplaced.join(', ')}</ListItem> : null}
          {fit.warnings.map((w) => (
            <ListItem key={w}>{w}</ListItem>
          ))}
        </List>
      ) : null}
    </Box>
  );
}
