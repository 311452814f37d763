# Reference values for lib/models from R's lm(), summary.lm(), predict.lm(), hatvalues(), rstandard()
# and rstudent(). Run once with `Rscript scripts/reference/lm-reference.R > tests/unit/models/lm-reference.json`;
# the tests read the JSON, so R is never needed at test time. The data sets are written out below
# (NIST StRD Norris and Longley; Montgomery's central composite yield example; an invented weighted
# panel example), so R's own copies (e.g. datasets::longley, in other units) play no part.

num <- function(x) {
  if (length(x) == 0) return("[]")
  v <- ifelse(is.na(x), "null", trimws(formatC(x, digits = 17, format = "g")))
  if (length(x) == 1 && is.null(names(x))) return(v)
  paste0("[", paste(v, collapse = ", "), "]")
}
obj <- function(...) {
  parts <- list(...)
  paste0("{", paste(sprintf('"%s": %s', names(parts), unlist(parts)), collapse = ", "), "}")
}
press <- function(fit) {
  w <- if (is.null(weights(fit))) rep(1, length(residuals(fit))) else weights(fit)
  sum(w * (residuals(fit) / (1 - hatvalues(fit)))^2)
}
describe <- function(fit, newdata) {
  s <- summary(fit)
  co <- coef(s)
  pm <- predict(fit, newdata, interval = "confidence", level = 0.95)
  pp <- if (is.null(weights(fit))) predict(fit, newdata, interval = "prediction", level = 0.95) else
    predict(fit, newdata, interval = "prediction", level = 0.95, weights = 1)
  se <- predict(fit, newdata, se.fit = TRUE)$se.fit
  obj(
    coefficients = num(unname(co[, 1])),
    standardErrors = num(unname(co[, 2])),
    tValues = num(unname(co[, 3])),
    pValues = num(unname(co[, 4])),
    sigma = num(s$sigma),
    df = num(fit$df.residual),
    rSquared = num(s$r.squared),
    adjustedRSquared = num(s$adj.r.squared),
    fStatistic = num(unname(s$fstatistic[1])),
    fP = num(unname(pf(s$fstatistic[1], s$fstatistic[2], s$fstatistic[3], lower.tail = FALSE))),
    press = num(press(fit)),
    leverages = num(unname(hatvalues(fit))),
    standardized = num(unname(rstandard(fit))),
    studentized = num(unname(rstudent(fit))),
    fitAtNew = num(unname(pm[, 1])),
    seFitAtNew = num(unname(se)),
    confidenceLow = num(unname(pm[, 2])),
    confidenceHigh = num(unname(pm[, 3])),
    predictionLow = num(unname(pp[, 2])),
    predictionHigh = num(unname(pp[, 3]))
  )
}

# NIST StRD Norris.dat
norris <- data.frame(
  x = c(0.2, 337.4, 118.2, 884.6, 10.1, 226.5, 666.3, 996.3, 448.6, 777, 558.2, 0.4, 0.6, 775.5, 666.9, 338,
        447.5, 11.6, 556, 228.1, 995.8, 887.6, 120.2, 0.3, 0.3, 556.8, 339.1, 887.2, 999, 779, 11.1, 118.3,
        229.2, 669.1, 448.9, 0.5),
  y = c(0.1, 338.8, 118.1, 888, 9.2, 228.1, 668.5, 998.5, 449.1, 778.9, 559.2, 0.3, 0.1, 778.1, 668.8, 339.3,
        448.9, 10.8, 557.7, 228.3, 998, 888.8, 119.6, 0.3, 0.6, 557.6, 339.3, 888, 998.5, 778.9, 10.2, 117.6,
        228.9, 668.4, 449.2, 0.2))
norrisFit <- lm(y ~ x, norris)

# NIST StRD Longley.dat
longley7 <- data.frame(matrix(c(
  60323, 83, 234289, 2356, 1590, 107608, 1947, 61122, 88.5, 259426, 2325, 1456, 108632, 1948,
  60171, 88.2, 258054, 3682, 1616, 109773, 1949, 61187, 89.5, 284599, 3351, 1650, 110929, 1950,
  63221, 96.2, 328975, 2099, 3099, 112075, 1951, 63639, 98.1, 346999, 1932, 3594, 113270, 1952,
  64989, 99, 365385, 1870, 3547, 115094, 1953, 63761, 100, 363112, 3578, 3350, 116219, 1954,
  66019, 101.2, 397469, 2904, 3048, 117388, 1955, 67857, 104.6, 419180, 2822, 2857, 118734, 1956,
  68169, 108.4, 442769, 2936, 2798, 120445, 1957, 66513, 110.8, 444546, 4681, 2637, 121950, 1958,
  68655, 112.6, 482704, 3813, 2552, 123366, 1959, 69564, 114.2, 502601, 3931, 2514, 125368, 1960,
  69331, 115.7, 518173, 4806, 2572, 127852, 1961, 70551, 116.9, 554894, 4007, 2827, 130081, 1962),
  ncol = 7, byrow = TRUE, dimnames = list(NULL, c("y", paste0("x", 1:6)))))
longleyFit <- lm(y ~ ., longley7)
longleyNew <- data.frame(x1 = 100, x2 = 400000, x3 = 3000, x4 = 2500, x5 = 118000, x6 = 1955)

# Montgomery, Design and Analysis of Experiments, chemical process yield, central composite design
# in coded time (x1) and temperature (x2), alpha = 1.414, five centre runs (the CCD example of ch. 11).
ccd <- data.frame(
  x1 = c(-1, -1, 1, 1, 0, 0, 0, 0, 0, 1.414, -1.414, 0, 0),
  x2 = c(-1, 1, -1, 1, 0, 0, 0, 0, 0, 0, 0, 1.414, -1.414),
  y = c(76.5, 77.0, 78.0, 79.5, 79.9, 80.3, 80.0, 79.7, 79.8, 78.4, 75.6, 78.5, 77.0))
ccdFit <- lm(y ~ x1 + x2 + x1:x2 + I(x1^2) + I(x2^2), ccd)
ccdCells <- lm(y ~ factor(paste(x1, x2)), ccd)
lof <- anova(ccdFit, ccdCells)
ccdNew <- data.frame(x1 = c(0.389, 1), x2 = c(0.306, -0.5))

# Invented panel means (demo scenario): liking by pectin % and soluble solids, each mean with its
# panel size n and standard deviation s; weights n / s^2.
panel <- data.frame(
  pectin = c(0.4, 0.4, 0.8, 0.8, 0.6, 0.6, 0.6, 0.3, 0.9, 0.6, 0.6),
  solids = c(55, 65, 55, 65, 60, 60, 60, 60, 60, 52, 68),
  liking = c(5.1, 6.0, 5.9, 6.3, 6.8, 6.6, 6.9, 5.2, 6.0, 5.5, 6.1),
  n = c(12, 12, 10, 12, 14, 12, 12, 10, 11, 12, 12),
  s = c(1.6, 1.4, 1.9, 1.5, 1.2, 1.3, 1.1, 1.8, 1.7, 1.6, 1.5))
panel$w <- panel$n / panel$s^2
panelFit <- lm(liking ~ pectin + solids + pectin:solids + I(pectin^2) + I(solids^2), panel, weights = w)
panelNew <- data.frame(pectin = c(0.6, 0.75), solids = c(60, 58))
panelCells <- lm(liking ~ factor(paste(pectin, solids)), panel, weights = w)
panelLof <- anova(panelFit, panelCells)

cat("{\n")
cat(sprintf('"rVersion": "%s",\n', R.version.string))
cat(sprintf('"norris": %s,\n', describe(norrisFit, data.frame(x = c(500, 1200)))))
cat(sprintf('"longley": %s,\n', describe(longleyFit, longleyNew)))
cat(sprintf('"ccd": %s,\n', describe(ccdFit, ccdNew)))
cat(sprintf('"ccdLackOfFit": %s,\n', obj(
  residualSs = num(lof$RSS[1]), residualDf = num(lof$Res.Df[1]),
  pureErrorSs = num(lof$RSS[2]), pureErrorDf = num(lof$Res.Df[2]),
  f = num(lof$F[2]), p = num(lof[2, "Pr(>F)"]))))
cat(sprintf('"panel": %s,\n', describe(panelFit, panelNew)))
cat(sprintf('"panelLackOfFit": %s\n', obj(
  residualSs = num(panelLof$RSS[1]), residualDf = num(panelLof$Res.Df[1]),
  pureErrorSs = num(panelLof$RSS[2]), pureErrorDf = num(panelLof$Res.Df[2]),
  f = num(panelLof$F[2]), p = num(panelLof[2, "Pr(>F)"]))))
cat("}\n")
