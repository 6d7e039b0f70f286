/*
 * The Slackwater query language.
 *
 * Plain English clauses in a fixed order. Keywords are case-insensitive and reserved, except
 * the hemisphere letters (n, s, e, w) and the distance units (m, km), which may also name a
 * variable. The grammar is kept LL(1) on purpose: every syntax error is then found at the
 * first token that cannot fit, and the expected-token set describes exactly that place.
 *
 * Values are checked (dates, ranges, percentiles) by the AST builder, not here, so that the
 * messages can say what is wrong with a value instead of which token was unexpected.
 *
 * Recursion is bounded: '(' is limited in depth and arithmetic operators in number (see
 * LimitedTokenSource), and 'not' and unary '-' take one operand each, never a chain, so that
 * no input can nest deeper than those limits.
 */
grammar Slackwater;

options { caseInsensitive = true; }

// The lexer reads a unit word in two places: after 'in', and after a number inside 'let' and
// 'watch' when the word has digits or unit signs (10 mg/m3); see the members below.
// A unit after 'in' (mm/day, mg/m3, m-3, degF) is one word, but '/' and '-' mean other things
// elsewhere, so the lexer reads it by hand in that one place; a lexer predicate would do the
// same but turns off the lexer's DFA cache and makes all lexing many times slower.
tokens { UNIT_WORD }

@lexer::members {
    /** The type of the last token on the default channel. */
    private int lastTokenType = 0;
    /** The first token type of the current statement, 0 before it is seen. */
    private int statementType = 0;

    @Override
    public Token nextToken() {
        Token token;
        if (lastTokenType == IN && isUnitStart(_input.LA(1))) {
            token = unitWord(false);
        } else if (lastTokenType == NUMBER && unitsFollowNumbers() && isCompoundUnitAhead()) {
            token = unitWord(true);
        } else {
            token = super.nextToken();
        }
        if (token.getChannel() == Token.DEFAULT_CHANNEL) {
            lastTokenType = token.getType();
            if (token.getType() == SEMI) {
                statementType = 0;
            } else if (statementType == 0) {
                statementType = token.getType();
            }
        }
        return token;
    }

    @Override
    public void reset() {
        super.reset();
        lastTokenType = 0;
        statementType = 0;
    }

    /**
     * In 'let' and 'watch' a number may carry a unit (25 degC, 10 mg/m3). A plain word is
     * lexed as usual (it may be a keyword such as 'for'); a word with digits or unit signs is
     * one unit word. '*' is left out there because it multiplies in 'let'.
     */
    private boolean unitsFollowNumbers() {
        return statementType == LET || statementType == WATCH;
    }

    private boolean isCompoundUnitAhead() {
        int c = _input.LA(1);
        if (!((c >= 'a' && c <= 'z') || (c >= 'A' && c <= 'Z') || c == '%')) {
            return false;
        }
        for (int i = 1; isUnitPart(_input.LA(i), true); i++) {
            int d = _input.LA(i);
            if (!((d >= 'a' && d <= 'z') || (d >= 'A' && d <= 'Z') || d == '_')) {
                return true;
            }
        }
        return false;
    }

    /** A unit word: [A-Za-z0-9%] then [A-Za-z0-9_%/-^.*]* (no * after a number); QueryPrinter writes the same set bare. */
    private Token unitWord(boolean afterNumber) {
        int start = _input.index();
        int line = getLine();
        int column = getCharPositionInLine();
        getInterpreter().consume(_input);
        while (isUnitPart(_input.LA(1), afterNumber)) {
            getInterpreter().consume(_input);
        }
        // ANTLR gives the lexer no constant for a token that has no lexer rule; the parser has it.
        Token token = _factory.create(_tokenFactorySourcePair, SlackwaterParser.UNIT_WORD, null, Token.DEFAULT_CHANNEL,
                start, _input.index() - 1, line, column);
        emit(token);
        return token;
    }

    private static boolean isUnitStart(int c) {
        return (c >= 'a' && c <= 'z') || (c >= 'A' && c <= 'Z') || (c >= '0' && c <= '9') || c == '%';
    }

    private static boolean isUnitPart(int c, boolean afterNumber) {
        return isUnitStart(c) || c == '_' || c == '/' || c == '-' || c == '^' || c == '.' || (c == '*' && !afterNumber);
    }
}

// ---------------------------------------------------------------------------------------------
// Parser rules

script
    : statement (SEMI statement)* SEMI? EOF
    ;

// One labelled alternative per statement kind; later versions add alternatives here.
statement
    : statistic variable OVER region period step unitClause? comparisonClause? gapClause? coverageClause?  # areaSeries
    | LIST catalogList                                                                        # listCatalog
    | DESCRIBE variable                                                                        # describeVariable
    | CORRELATE seriesTerm WITH seriesTerm OVER region period step
          lagClause? methodClause? deseasonalizeClause? gapClause? coverageClause?             # correlation
    | RANK DRIVERS OF seriesTerm AMONG seriesTerm (COMMA seriesTerm)* OVER region period step
          lagClause? methodClause? baselineClause? gapClause? coverageClause?                  # driverRanking
    | WINDOW duration BEFORE date (COMMA date)* OF seriesTerm (COMMA seriesTerm)* OVER region
          baselineClause? coverageClause?                                                      # eventWindow
    | MAP mapSpec                                                                              # map
    | WATCH STRING OVER region watchRule+                                                      # watch
    | LET variable EQUALS expression unitClause?                                               # derivedVariable
    | CELLS OF variable OVER region period unitClause?                                         # cellExport
    ;

// 'list variables' and 'list regions' share their first word; one rule keeps the grammar LL(1).
catalogList
    : VARIABLES     # variablesList
    | REGIONS       # regionsList
    ;

statistic
    : MEAN          # meanStatistic
    | SUM           # sumStatistic
    | MIN           # minStatistic
    | MAX           # maxStatistic
    | MEDIAN        # medianStatistic
    | PERCENTILE_STAT  # percentileStatistic
    ;

variable
    : identifier
    ;

identifier
    : IDENT
    | N | S | E | W | M | KM
    ;

// 'clipped to' is a left-associative loop, not recursion, so long chains cost no stack.
region
    : regionPrimary (CLIPPED TO regionPrimary)*
    ;

regionPrimary
    : STRING                                              # namedRegion
    | CIRCLE LPAREN coordinate COMMA distance RPAREN      # circleRegion
    | BOX LPAREN coordinate COMMA coordinate RPAREN       # boxRegion
    | WKT STRING                                          # wktRegion
    | LPAREN region RPAREN                                # parenthesizedRegion
    ;

coordinate
    : latitude COMMA longitude
    ;

latitude
    : angle
    ;

longitude
    : angle
    ;

angle
    : MINUS? NUMBER hemisphere?
    ;

hemisphere
    : N | S | E | W
    ;

distance
    : NUMBER distanceUnit
    ;

// Any word is accepted here so that the builder can say "use m or km" for 'mi' or 'ft'.
distanceUnit
    : M | KM | IDENT
    ;

period
    : FROM date TO date             # fromToPeriod
    | DURING date (TO date)?        # duringPeriod
    ;

baseline
    : date (TO date)?
    ;

// A bare year lexes as a NUMBER; the builder checks the shape of both kinds.
date
    : DATE
    | NUMBER
    ;

step
    : BY stepUnit
    ;

stepUnit
    : DAY               # dayStep
    | WEEK              # weekStep
    | MONTH             # monthStep
    | SEASON            # seasonStep
    | YEAR              # yearStep
    | WATER YEAR        # waterYearStep
    ;

unitClause
    : IN (UNIT_WORD | STRING)
    ;

comparisonClause
    : AS comparisonKind (AGAINST baseline)?
    ;

comparisonKind
    : ANOMALY                 # anomalyComparison
    | STANDARDIZED ANOMALY    # standardizedAnomalyComparison
    | PERCENTILE              # percentileRankComparison
    ;

coverageClause
    : WITH COVERAGE AT LEAST NUMBER PERCENT
    ;

// How many native days a step may miss and still have a value: 'with at most 5 missing days,
// 3 consecutive'. Without it a mean needs one day with a value and a sum needs every day.
gapClause
    : WITH AT MOST NUMBER MISSING DAYS (COMMA NUMBER CONSECUTIVE)?
    ;

// ---- parts of the statements being built ---------------------------------------------------

// A variable as a series; the statistic defaults to mean, the region to the statement's 'over'.
seriesTerm
    : statistic? variable withinClause?
    ;

// The series' own region: 'sum rainfall within "Harle Watershed"'.
withinClause
    : WITHIN region
    ;

// A series of a map: a map takes its region from 'over', so there is no 'within' here; the
// error for one names that rule (see SyntaxErrors).
mapTerm
    : statistic? variable
    ;

// A whole number of days, weeks, ... (the builder checks that it is whole and in range).
duration
    : NUMBER durationUnit
    ;

durationUnit
    : (DAY | DAYS)          # dayUnit
    | (WEEK | WEEKS)        # weekUnit
    | (MONTH | MONTHS)      # monthUnit
    | (SEASON | SEASONS)    # seasonUnit
    | (YEAR | YEARS)        # yearUnit
    ;

lagClause
    : lagRange
    | singleLag
    ;

lagRange
    : LAGS lagValue TO lagValue durationUnit (STEP duration)?
    ;

singleLag
    : AT LAG lagValue durationUnit
    ;

lagValue
    : MINUS? NUMBER
    ;

// Any word, so that the builder can name the methods there are ("use pearson or spearman").
methodClause
    : USING identifier
    ;

deseasonalizeClause
    : (DESEASONALIZED | AS ANOMALIES) baselineClause?
    ;

baselineClause
    : AGAINST baseline
    ;

mapSpec
    : mapTerm OVER region period differenceClause? unitClause? comparisonClause?          # statisticMap
    | CORRELATION OF mapTerm OVER region WITH mapTerm OVER region period step
          lagClause? methodClause? deseasonalizeClause?                                   # correlationMap
    ;

differenceClause
    : MINUS_WORD baseline
    ;

// Any word after 'severity', checked by the builder like the method.
watchRule
    : WHEN condition (SEVERITY identifier)?
    ;

// 'or' binds less tightly than 'and'; both are loops, so long chains cost no stack.
condition
    : conjunction (OR conjunction)*
    ;

conjunction
    : negation (AND negation)*
    ;

negation
    : NOT? conditionPrimary
    ;

conditionPrimary
    : LPAREN condition RPAREN                                                  # groupedCondition
    | watchSeries threshold persistence?                                      # thresholdCondition
    | comparisonKind OF watchSeries threshold baselineClause? persistence?   # comparisonCondition
    ;

// 'over' takes a region, a window (over 30 days), or a region and then a window.
watchSeries
    : statistic? variable (OVER watchOver)?
    ;

watchOver
    : duration                   # windowOnly
    | region (OVER duration)?    # regionAndWindow
    ;

threshold
    : comparator MINUS? NUMBER numberUnit?
    ;

// 'at least' and 'at most' share 'at'; one alternative keeps the choice to one token.
comparator
    : ABOVE               # aboveComparator
    | BELOW               # belowComparator
    | AT (LEAST | MOST)   # atComparator
    ;

persistence
    : FOR duration
    ;

// A unit right after a number: a plain word, a unit word (mg/m3) or a quoted unit.
numberUnit
    : UNIT_WORD
    | STRING
    | identifier
    ;

// Precedence by rule level: + - below * /, unary minus on one primary.
expression
    : term ((PLUS | MINUS) term)*
    ;

term
    : factor ((STAR | SLASH) factor)*
    ;

factor
    : MINUS? primary
    ;

primary
    : NUMBER numberUnit?               # numberPrimary
    | variable                         # variablePrimary
    | LPAREN expression RPAREN         # parenthesizedPrimary
    ;

// ---------------------------------------------------------------------------------------------
// Lexer rules. The order of the keywords is the order in which they are listed in
// "expected one of: ..." messages.

MEAN         : 'mean' ;
SUM          : 'sum' ;
MIN          : 'min' ;
MAX          : 'max' ;
MEDIAN       : 'median' ;
LIST         : 'list' ;
DESCRIBE     : 'describe' ;
VARIABLES    : 'variables' ;
REGIONS      : 'regions' ;
OVER         : 'over' ;
CIRCLE       : 'circle' ;
BOX          : 'box' ;
WKT          : 'wkt' ;
FROM         : 'from' ;
DURING       : 'during' ;
CLIPPED      : 'clipped' ;
TO           : 'to' ;
BY           : 'by' ;
DAY          : 'day' ;
WEEK         : 'week' ;
MONTH        : 'month' ;
SEASON       : 'season' ;
YEAR         : 'year' ;
WATER        : 'water' ;
IN           : 'in' ;
AS           : 'as' ;
ANOMALY      : 'anomaly' ;
STANDARDIZED : 'standardized' ;
PERCENTILE   : 'percentile' ;
AGAINST      : 'against' ;
WITH         : 'with' ;
COVERAGE     : 'coverage' ;
AT           : 'at' ;
LEAST        : 'least' ;
N            : 'n' ;
S            : 's' ;
E            : 'e' ;
W            : 'w' ;
M            : 'm' ;
KM           : 'km' ;
CORRELATE    : 'correlate' ;
LAGS         : 'lags' ;
LAG          : 'lag' ;
STEP         : 'step' ;
USING        : 'using' ;
DESEASONALIZED : 'deseasonalized' ;
ANOMALIES    : 'anomalies' ;
RANK         : 'rank' ;
DRIVERS      : 'drivers' ;
OF           : 'of' ;
AMONG        : 'among' ;
WINDOW       : 'window' ;
BEFORE       : 'before' ;
DAYS         : 'days' ;
WEEKS        : 'weeks' ;
MONTHS       : 'months' ;
SEASONS      : 'seasons' ;
YEARS        : 'years' ;
MAP          : 'map' ;
CELLS        : 'cells' ;
MINUS_WORD   : 'minus' ;
CORRELATION  : 'correlation' ;
WATCH        : 'watch' ;
WHEN         : 'when' ;
SEVERITY     : 'severity' ;
ABOVE        : 'above' ;
BELOW        : 'below' ;
MOST         : 'most' ;
MISSING      : 'missing' ;
CONSECUTIVE  : 'consecutive' ;
FOR          : 'for' ;
AND          : 'and' ;
OR           : 'or' ;
NOT          : 'not' ;
LET          : 'let' ;
WITHIN       : 'within' ;

// p1 .. p99; any digits are taken so that p0 and p100 get a message about the range.
PERCENTILE_STAT : 'p' [0-9]+ ;

IDENT  : [a-z_] [a-z0-9_]* ;

// Lenient on purpose (2014-7, 14-07-01): the builder names the exact problem.
DATE   : [0-9]+ '-' [0-9]+ ('-' [0-9]+)? ;
NUMBER : [0-9]+ ('.' [0-9]+)? ;

STRING : '"' (~["\\\r\n] | '\\' ~[\r\n])* '"' ;
// A string that reaches the end of the line; reported as unterminated before parsing.
UNTERMINATED_STRING : '"' (~["\\\r\n] | '\\' ~[\r\n])* '\\'? ;

LPAREN  : '(' ;
RPAREN  : ')' ;
COMMA   : ',' ;
SEMI    : ';' ;
MINUS   : '-' ;
PERCENT : '%' ;
PLUS    : '+' ;
STAR    : '*' ;
SLASH   : '/' ;
EQUALS  : '=' ;

COMMENT : '#' ~[\r\n]* -> channel(HIDDEN) ;
WS      : [ \t\r\n\f]+ -> channel(HIDDEN) ;

// Anything else; reported as an unexpected character before parsing, so the lexer never fails.
ERROR_CHAR : . ;
