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
 */
grammar Slackwater;

options { caseInsensitive = true; }

// A unit after 'in' (mm/day, mg/m3, m-3, degF) is one word, but '/' and '-' mean other things
// elsewhere, so the lexer reads it by hand in that one place; a lexer predicate would do the
// same but turns off the lexer's DFA cache and makes all lexing many times slower.
tokens { UNIT_WORD }

@lexer::members {
    /** The type of the last token on the default channel. */
    private int lastTokenType = 0;

    @Override
    public Token nextToken() {
        Token token = lastTokenType == IN && isUnitStart(_input.LA(1)) ? unitWord() : super.nextToken();
        if (token.getChannel() == Token.DEFAULT_CHANNEL) {
            lastTokenType = token.getType();
        }
        return token;
    }

    @Override
    public void reset() {
        super.reset();
        lastTokenType = 0;
    }

    /** A unit word: [A-Za-z0-9%] then [A-Za-z0-9_%/-^.*]*; QueryPrinter writes the same set bare. */
    private Token unitWord() {
        int start = _input.index();
        int line = getLine();
        int column = getCharPositionInLine();
        getInterpreter().consume(_input);
        while (isUnitPart(_input.LA(1))) {
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

    private static boolean isUnitPart(int c) {
        return isUnitStart(c) || c == '_' || c == '/' || c == '-' || c == '^' || c == '.' || c == '*';
    }
}

// ---------------------------------------------------------------------------------------------
// Parser rules

script
    : statement (SEMI statement)* SEMI? EOF
    ;

// One labelled alternative per statement kind; later versions add alternatives here.
statement
    : statistic variable OVER region period step unitClause? comparisonClause? coverageClause?  # areaSeries
    | LIST catalogList                                                                        # listCatalog
    | DESCRIBE variable                                                                        # describeVariable
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

COMMENT : '#' ~[\r\n]* -> channel(HIDDEN) ;
WS      : [ \t\r\n\f]+ -> channel(HIDDEN) ;

// Anything else; reported as an unexpected character before parsing, so the lexer never fails.
ERROR_CHAR : . ;
